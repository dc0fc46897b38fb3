#!/usr/bin/python3
# Makes public/fonts/pedalpoint-music.woff2: the SMuFL glyphs the charts draw, cut from Bravura
# (node_modules/@vexflow-fonts/bravura). The whole font is 247 KB, most of it glyphs a chord chart
# never shows; the cut is ~40 KB. Bravura's licence (SIL OFL 1.1) reserves the name "Bravura", so the
# modified font carries its own family name, "Pedalpoint Music" (components/chart/music-fonts.ts).
# The output is committed; run this again only when the charts start drawing a new kind of glyph.
# Needs Debian's python3-fonttools and python3-brotli:  /usr/bin/python3 scripts/fonts/music-font.py
import os
from fontTools import subset
from fontTools.ttLib import TTFont

ROOT = os.path.join(os.path.dirname(__file__), "..", "..")
SOURCE = os.path.join(ROOT, "node_modules/@vexflow-fonts/bravura/bravura.otf")
OUT = os.path.join(ROOT, "public/fonts/pedalpoint-music.woff2")
FAMILY = "Pedalpoint Music"

# SMuFL ranges: repeats, segno and coda; treble, bass and percussion clefs (with octave variants);
# time signatures; plain noteheads; beat slashes; dots; stems and flags; the five standard accidentals
# and their parentheses; articulations; fermatas; rests; bar repeats; octave lines; dynamics; jazz
# brass marks (falls, doits, scoops); tuplet numbers.
RANGES = [
    (0xE030, 0xE04F), (0xE050, 0xE055), (0xE058, 0xE05A), (0xE062, 0xE066), (0xE069, 0xE069),
    (0xE080, 0xE09F), (0xE0A0, 0xE0A9), (0xE100, 0xE10F), (0xE1D0, 0xE1EF), (0xE210, 0xE211),
    (0xE240, 0xE25F), (0xE260, 0xE264), (0xE26A, 0xE26B), (0xE4A0, 0xE4CF), (0xE4E0, 0xE4F7),
    (0xE500, 0xE51F), (0xE520, 0xE54F), (0xE5D0, 0xE5EF), (0xE880, 0xE88F),
]

def main():
    font = TTFont(SOURCE)
    options = subset.Options()
    options.flavor = "woff2"
    options.layout_features = []
    options.layout_closure = False
    options.name_IDs = ["*"]
    sub = subset.Subsetter(options)
    sub.populate(unicodes=[u for a, b in RANGES for u in range(a, b + 1)])
    sub.subset(font)
    name = font["name"]
    for rec in name.names:
        if rec.nameID in (1, 16):
            rec.string = FAMILY
        elif rec.nameID == 4:
            rec.string = FAMILY
        elif rec.nameID == 6:
            rec.string = FAMILY.replace(" ", "")
        elif rec.nameID == 3:
            rec.string = f"{FAMILY}; cut from Bravura"
    font.flavor = "woff2"
    font.save(OUT)
    print(f"{OUT}: {os.path.getsize(OUT)} bytes")

main()
