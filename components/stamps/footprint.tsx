/**
 * A to-scale drawing of the stamp's footprint (and its outline, when recorded), with the width
 * and height written beside it: what people look at before they read the numbers.
 */
export function Footprint({
  widthMm,
  heightMm,
  outlinePath,
  mirrored,
  widthLabel,
  heightLabel,
  title,
  className,
}: {
  widthMm: number;
  heightMm: number;
  outlinePath: string | null;
  mirrored: boolean;
  widthLabel: string;
  heightLabel: string;
  title: string;
  className?: string;
}) {
  const pad = Math.max(widthMm, heightMm) * 0.14;
  const viewBox = `${-pad} ${-pad} ${widthMm + pad * 1.6} ${heightMm + pad * 1.6}`;
  const font = Math.max(widthMm, heightMm) * 0.06;
  return (
    <svg viewBox={viewBox} className={className} role="img" aria-label={title}>
      <title>{title}</title>
      <rect x={0} y={0} width={widthMm} height={heightMm} rx={Math.min(widthMm, heightMm) * 0.03} fill="#fbf5ef" stroke="#8a4f20" strokeWidth={font * 0.12} />
      {outlinePath ? (
        <path d={outlinePath} fill="#253363" fillOpacity={0.85} fillRule="evenodd" transform={mirrored ? `translate(${widthMm} 0) scale(-1 1)` : undefined} />
      ) : (
        <path
          d={`M${widthMm / 2} ${heightMm * 0.15} L${widthMm * 0.85} ${heightMm / 2} L${widthMm / 2} ${heightMm * 0.85} L${widthMm * 0.15} ${heightMm / 2} Z`}
          fill="none"
          stroke="#c3cce6"
          strokeWidth={font * 0.1}
          strokeDasharray={`${font * 0.4} ${font * 0.3}`}
        />
      )}
      <text x={widthMm / 2} y={-pad * 0.35} textAnchor="middle" fontSize={font} fill="#44403c">
        {widthLabel}
      </text>
      <text x={widthMm + pad * 0.3} y={heightMm / 2} fontSize={font} fill="#44403c" dominantBaseline="middle" transform={`rotate(90 ${widthMm + pad * 0.3} ${heightMm / 2})`} textAnchor="middle">
        {heightLabel}
      </text>
    </svg>
  );
}
