import { z } from "zod";
import { ready } from "@/db";
import { INSTRUMENT_IDS } from "@/lib/music";
import { route } from "@/lib/server/handler";
import { exportChartMusicXml } from "@/lib/server/musicxml-export";
import { ChartParams } from "@/lib/validation/band";

const Query = z.object({ instrument: z.enum(INSTRUMENT_IDS).default("concert") }).strict();

export const GET = route({ params: ChartParams, query: Query }, async ({ actor, params, query }) => {
  const { filename, xml } = await exportChartMusicXml(await ready(), actor, params.bandId, params.chartId, query.instrument);
  return new Response(xml, {
    headers: {
      "content-type": "application/vnd.recordare.musicxml+xml; charset=utf-8",
      "content-disposition": `attachment; filename="${filename.replace(/[^\x20-\x7e]/g, "_")}"; filename*=UTF-8''${encodeURIComponent(filename)}`,
      "cache-control": "private, no-store",
    },
  });
});
