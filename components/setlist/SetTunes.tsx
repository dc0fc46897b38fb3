"use client";
// One set's tunes in play order. Reorder by dragging the grip, by keyboard on the grip (Space to lift,
// arrows to move, Space to drop), or with the Up/Down buttons; each tune opens its arrangement.
import { partKeyInWords } from "@/lib/music/part-key";
import {
  closestCenter,
  DndContext,
  KeyboardSensor,
  PointerSensor,
  useSensor,
  useSensors,
  type Announcements,
  type DragEndEvent,
} from "@dnd-kit/core";
import { arrayMove, SortableContext, sortableKeyboardCoordinates, useSortable, verticalListSortingStrategy } from "@dnd-kit/sortable";
import { CSS } from "@dnd-kit/utilities";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import type { Chart } from "@/lib/chart/model";
import { endingInWords, entryIntroInWords, formatTuneLength, tuneTiming, type SetlistEntry } from "@/lib/setlist";
import { TuneArrangement } from "./TuneArrangement";

export interface TuneInfo {
  title: string;
  chart: Chart | null;
  /** Changed since this device last read it. */
  changed?: boolean;
}

interface Props {
  setNumber: number;
  setCount: number;
  entries: SetlistEntry[];
  tunes: Map<string, TuneInfo>;
  editable: boolean;
  onReorder: (entries: SetlistEntry[]) => void;
  onChange: (e: SetlistEntry) => void;
  onRemove: (id: string) => void;
  onMoveToSet: (id: string, setNumber: number) => void;
  /** Where the tune opens with tonight's choices (the chart page). */
  openHref?: (e: SetlistEntry) => string;
  /** The part the reader reads (an instrument id): keys are named in it, concert labelled. Concert if not given. */
  part?: string;
}

function titleOf(tunes: Map<string, TuneInfo>, e: SetlistEntry): string {
  return tunes.get(e.chartId)?.title ?? "(chart not on this device)";
}

function Row({ entry, index, props }: { entry: SetlistEntry; index: number; props: Props }) {
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, transform, transition, isDragging } = useSortable({ id: entry.id, disabled: !props.editable });
  const [open, setOpen] = useState(false);
  const tune = props.tunes.get(entry.chartId);
  const title = titleOf(props.tunes, entry);
  const seconds = tune?.chart ? tuneTiming(tune.chart, entry).seconds : null;
  const move = (to: number) => props.onReorder(arrayMove(props.entries, index, to));
  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Transform.toString(transform), transition }}
      className={`rounded-md border border-ink-soft bg-white p-3 ${isDragging ? "shadow-lg ring-2 ring-brass" : ""}`}
      data-testid="set-tune"
      data-title={title}
      data-changed={tune?.changed ? "true" : undefined}
    >
      <div className="flex flex-wrap items-center gap-2">
        {props.editable ? (
          <button
            type="button"
            ref={setActivatorNodeRef}
            className="min-h-11 min-w-11 cursor-grab rounded-md border border-ink-muted px-2 text-lg"
            aria-label={`Move ${title}: press Space to lift, arrow keys to move, Space to drop`}
            {...attributes}
            {...listeners}
          >
            <span aria-hidden="true">⠿</span>
          </button>
        ) : null}
        <span className="w-6 text-right font-semibold tabular-nums text-ink-muted">{index + 1}.</span>
        <div className="min-w-40 flex-1">
          <p className="font-semibold">
            {title}
            {tune?.changed ? <span className="ml-2 text-sm font-normal text-brass-dark">changed since you read it</span> : null}
          </p>
          <p className="text-sm text-ink-muted">
            <span data-testid="tune-key-shown">Key {entry.key ?? tune?.chart?.key ? partKeyInWords((entry.key ?? tune?.chart?.key)!, props.part ?? "concert") : "as written"}</span>
            {entry.tempo ? ` · ♩ = ${entry.tempo}` : ""} · Intro: {entryIntroInWords(entry)} · Ending: {endingInWords(entry.ending)}
            {entry.soloOrder ? ` · Solos: ${entry.soloOrder}${entry.choruses > 1 ? ` (${entry.choruses} choruses each)` : ""}` : ""}
            <span data-testid="tune-length">{seconds !== null ? ` · about ${formatTuneLength(seconds)}` : " · no tempo, length unknown"}</span>
          </p>
          {entry.notes ? <p className="text-sm">{entry.notes}</p> : null}
        </div>
        {props.openHref && tune ? (
          <Link href={props.openHref(entry)} className="min-h-11 px-2 py-2 font-semibold underline" aria-label={`Open ${title} as arranged tonight`} data-testid="open-tune">
            Open
          </Link>
        ) : null}
        {props.editable ? (
          <div className="flex flex-wrap gap-1">
            <Button tone="secondary" onClick={() => setOpen(!open)} aria-expanded={open} data-testid="arrange-tune">
              {open ? "Done" : "Arrange"}
            </Button>
            <Button tone="quiet" disabled={index === 0} onClick={() => move(index - 1)} aria-label={`Move ${title} up`}>
              Up
            </Button>
            <Button tone="quiet" disabled={index === props.entries.length - 1} onClick={() => move(index + 1)} aria-label={`Move ${title} down`}>
              Down
            </Button>
            {props.setCount > 1 ? (
              <label className="flex items-center gap-1 text-sm">
                <span className="sr-only">Move {title} to set</span>
                <select
                  className="min-h-11 rounded-md border border-ink-muted bg-white px-2"
                  value={props.setNumber}
                  onChange={(e) => props.onMoveToSet(entry.id, Number(e.target.value))}
                >
                  {Array.from({ length: props.setCount }, (_, i) => (
                    <option key={i} value={i + 1}>
                      Set {i + 1}
                    </option>
                  ))}
                </select>
              </label>
            ) : null}
            <Button tone="danger" onClick={() => props.onRemove(entry.id)} aria-label={`Remove ${title} from the set list`}>
              Remove
            </Button>
          </div>
        ) : null}
      </div>
      {open && props.editable ? (
        <div className="mt-3 border-t border-ink-soft pt-3">
          <TuneArrangement entry={entry} chart={tune?.chart ?? null} onChange={props.onChange} />
        </div>
      ) : null}
    </li>
  );
}

export function SetTunes(props: Props) {
  const sensors = useSensors(useSensor(PointerSensor, { activationConstraint: { distance: 6 } }), useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }));
  const name = (id: string | number) => {
    const e = props.entries.find((x) => x.id === id);
    return e ? titleOf(props.tunes, e) : "the tune";
  };
  const where = (id: string | number | undefined) => (id === undefined ? "" : `position ${props.entries.findIndex((x) => x.id === id) + 1} of ${props.entries.length}`);
  const announcements: Announcements = {
    onDragStart: ({ active }) => `Picked up ${name(active.id)} at ${where(active.id)}.`,
    onDragOver: ({ active, over }) => (over ? `${name(active.id)} is over ${where(over.id)}.` : `${name(active.id)} is not over a place.`),
    onDragEnd: ({ active, over }) => (over ? `${name(active.id)} dropped at ${where(over.id)}.` : `${name(active.id)} put back.`),
    onDragCancel: ({ active }) => `Move cancelled; ${name(active.id)} put back.`,
  };
  function onDragEnd(ev: DragEndEvent) {
    const { active, over } = ev;
    if (!over || active.id === over.id) return;
    const from = props.entries.findIndex((e) => e.id === active.id);
    const to = props.entries.findIndex((e) => e.id === over.id);
    if (from >= 0 && to >= 0) props.onReorder(arrayMove(props.entries, from, to));
  }
  if (props.entries.length === 0) return <p className="py-3 text-ink-muted">No tunes in this set yet.</p>;
  return (
    <DndContext sensors={sensors} collisionDetection={closestCenter} onDragEnd={onDragEnd} accessibility={{ announcements }}>
      <SortableContext items={props.entries.map((e) => e.id)} strategy={verticalListSortingStrategy}>
        <ol className="flex flex-col gap-2" aria-label={`Set ${props.setNumber}`}>
          {props.entries.map((e, i) => (
            <Row key={e.id} entry={e} index={i} props={props} />
          ))}
        </ol>
      </SortableContext>
    </DndContext>
  );
}
