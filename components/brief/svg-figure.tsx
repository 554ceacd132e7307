/** A printable chart: an SVG drawing with its accessible name, and the caption under it. */
export function SvgFigure({
  width,
  height,
  label,
  caption,
  children,
}: {
  width: number;
  height: number;
  label: string;
  caption: React.ReactNode;
  children: React.ReactNode;
}) {
  return (
    <figure className="break-inside-avoid">
      <svg viewBox={`0 0 ${width} ${height}`} className="w-full" role="img" aria-label={label}>
        {children}
      </svg>
      <figcaption className="text-xs text-ink-soft">{caption}</figcaption>
    </figure>
  );
}
