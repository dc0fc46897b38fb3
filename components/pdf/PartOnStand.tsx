"use client";
// A chart's PDF or image part in the bandstand view (`…/bandstand?part=<id>`), read from this device.
import { useLiveQuery } from "dexie-react-hooks";
import Link from "next/link";
import { chartParts, readPartFile } from "@/lib/offline/parts";
import { getLocalBook } from "@/lib/offline/db";
import { useOnline } from "@/lib/offline/hooks";
import { PartScreen } from "./PartScreen";

export interface PartOnStandProps {
  chartId: string;
  chartTitle: string;
  partId: string;
  exitHref: string;
}

export function PartOnStand({ chartId, chartTitle, partId, exitHref }: PartOnStandProps) {
  const online = useOnline();
  const parts = useLiveQuery(() => chartParts(getLocalBook(), chartId), [chartId]);
  const file = useLiveQuery(() => readPartFile(getLocalBook(), partId), [partId]);
  if (parts === undefined || file === undefined) return <p className="p-6">Opening the part…</p>;
  const part = parts.find((p) => p.id === partId);
  if (!part || file === null) {
    return (
      <p role="alert" className="p-6">
        This part is not on this device yet. Open it once with a connection and it will be kept here.{" "}
        <Link className="underline" href={exitHref}>
          Back
        </Link>
      </p>
    );
  }
  return <PartScreen file={file} type={part.type} label={`${chartTitle}: ${part.filename}`} exitHref={exitHref} offline={!online} />;
}
