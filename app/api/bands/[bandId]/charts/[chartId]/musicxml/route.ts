import { z } from "zod";
import { INSTRUMENT_IDS } from "@/lib/music";
import { route } from "@/lib/server/handler";
import { exportChartMusicXml } from "@/lib/server/musicxml-export";
import { ChartParams } from "@/lib/validation/params";

// setlist + entry: tonight's arrangement of the chart on that set list (both or neither)
const Query = z
  .object({ instrument: z.enum(INSTRUMENT_IDS).default("concert"), setlist: z.uuid().optional(), entry: z.uuid().optional() })
  .strict()
  .refine((q) => (q.setlist === undefined) === (q.entry === undefined), { message: "Give both setlist and entry, or neither", path: ["entry"] });

export const GET = route({ params: ChartParams, query: Query }, async ({ db, actor, params, query }) => {
  const { filename, xml } = await exportChartMusicXml(db, actor, params.bandId, params.chartId, query.instrument, query.setlist && query.entry ? { setlistId: query.setlist, entryId: query.entry } : undefined);
  return new Response(xml, {
    headers: {
      "content-type": "application/vnd.recordare.musicxml+xml; charset=utf-8",
      "content-disposition": `attachment; filename="${filename.replace(/[^\x20-\x7e]/g, "_")}"; filename*=UTF-8''${encodeURIComponent(filename)}`,
      "cache-control": "private, no-store",
    },
  });
});
