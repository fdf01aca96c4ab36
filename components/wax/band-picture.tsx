import type { BandPlacement } from "@/lib/wax";

/**
 * Where an estimate's grams per metre sit against the published band for stamped batik (Nurdalia 2006: benchmark
 * 100–150 g/m, measured 152, 191 and 242 g/m; the SPEC's sanity band about 100–250 g/m). Plain SVG attributes only
 * (the pages' CSP allows no inline styles).
 */
export function BandPicture({ band, label, labels }: { band: BandPlacement; label: string; labels: { benchmark: string; measured: string; estimate: string } }) {
  const top = Math.max(300, Math.ceil((band.gramsPerMetre * 1.15) / 50) * 50);
  const width = 600;
  const x = (g: number) => 20 + (Math.min(g, top) / top) * (width - 40);
  const ticks = [0, band.benchmarkGPerM.min, band.benchmarkGPerM.max, band.sanityGPerM.max, top];
  const marker = x(band.gramsPerMetre);
  return (
    <svg viewBox={`0 0 ${width} 84`} className="h-auto w-full max-w-2xl" role="img" aria-label={label} data-testid="band-picture" data-position={band.position}>
      <rect x={x(0)} y={30} width={x(band.benchmarkGPerM.min) - x(0)} height={18} fill="#e7e5e4" />
      <rect x={x(band.benchmarkGPerM.min)} y={30} width={x(band.benchmarkGPerM.max) - x(band.benchmarkGPerM.min)} height={18} fill="#a7f3d0" />
      <rect x={x(band.benchmarkGPerM.max)} y={30} width={x(band.sanityGPerM.max) - x(band.benchmarkGPerM.max)} height={18} fill="#d9f99d" />
      <rect x={x(band.sanityGPerM.max)} y={30} width={x(top) - x(band.sanityGPerM.max)} height={18} fill="#fecaca" />
      {band.measuredGPerM.map((g) => (
        <line key={g} x1={x(g)} x2={x(g)} y1={30} y2={48} stroke="#3f6212" strokeWidth={2} />
      ))}
      <text x={(x(band.benchmarkGPerM.min) + x(band.benchmarkGPerM.max)) / 2} y={78} textAnchor="middle" fontSize={11} fill="#065f46">
        {labels.benchmark}
      </text>
      <text x={(x(band.benchmarkGPerM.max) + x(band.sanityGPerM.max)) / 2} y={78} textAnchor="middle" fontSize={11} fill="#3f6212">
        {labels.measured}
      </text>
      {ticks.map((g) => (
        <text key={g} x={x(g)} y={62} textAnchor="middle" fontSize={10} fill="#57534e">
          {g}
        </text>
      ))}
      <path d={`M ${marker - 7} 14 h 14 l -7 14 z`} fill="#1c1917" />
      <text x={Math.min(Math.max(marker, 60), width - 60)} y={11} textAnchor="middle" fontSize={12} fontWeight={600} fill="#1c1917">
        {labels.estimate}
      </text>
    </svg>
  );
}
