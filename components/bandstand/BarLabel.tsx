// A bandstand bar label: the words on a wide screen, a single sign on a phone (bandstand.css swaps
// them at 560 px). Both halves are hidden from a screen reader, so every button that uses one names
// itself with aria-label.
export function BarLabel({ long, short }: { long: string; short: string }) {
  return (
    <>
      <span className="pp-long" aria-hidden="true">
        {long}
      </span>
      <span className="pp-short" aria-hidden="true">
        {short}
      </span>
    </>
  );
}
