import { useId } from 'react';

export interface DrawnCurve {
  points: readonly { y: number; z: number }[];
  label: string;
  /** `before`: the revision the hull has now (dashed); `after`: the other one (solid). */
  tone: 'before' | 'after';
}

const W = 640;
const H = 230;
const M = 28;

const toneClass = { before: 'stroke-edge', after: 'stroke-primary' } as const;

/**
 * Camber curves over the beam, drawn over each other. The rise of a deck is small against its beam, so
 * heights are drawn larger than widths; the drawing says by how much, and the figures under it are true.
 */
export function CamberDrawing({ curves, halfBeamMm, title }: { curves: DrawnCurve[]; halfBeamMm: number; title: string }) {
  const titleId = useId();
  const maxZ = Math.max(1, ...curves.flatMap((c) => c.points.map((p) => p.z)));
  const sx = (W - 2 * M) / (2 * halfBeamMm);
  const sz = (H - 2 * M - 20) / maxZ;
  const exaggeration = sz / sx;
  const px = (y: number) => M + (y + halfBeamMm) * sx;
  const pz = (z: number) => H - M - z * sz;
  const path = (points: DrawnCurve['points']) => points.map((p, i) => `${i ? 'L' : 'M'}${px(p.y).toFixed(1)} ${pz(p.z).toFixed(1)}`).join(' ');

  return (
    <figure className="flex flex-col gap-2">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby={titleId} className="w-full max-w-3xl rounded-lg border border-rule bg-surface">
        <title id={titleId}>{title}</title>
        {/* Beam line (the ends of the deck at this beam) and the centreline. */}
        <line x1={px(-halfBeamMm)} x2={px(halfBeamMm)} y1={pz(0)} y2={pz(0)} className="stroke-rule" strokeWidth={2} />
        <line x1={px(0)} x2={px(0)} y1={M - 10} y2={H - M + 8} className="stroke-mark" strokeWidth={1.5} strokeDasharray="6 4" />
        {curves.map((c) => (
          <path key={c.label} d={path(c.points)} fill="none" className={toneClass[c.tone]} strokeWidth={c.tone === 'after' ? 3 : 2.5} strokeDasharray={c.tone === 'before' ? '9 6' : undefined} />
        ))}
        <text x={px(0) + 6} y={M - 2} className="fill-muted text-[13px]">
          centreline
        </text>
        <text x={W - M} y={H - 8} textAnchor="end" className="fill-muted text-[13px]">
          {`beam ${Math.round(2 * halfBeamMm)} mm; heights drawn ${exaggeration.toFixed(1)} × larger`}
        </text>
      </svg>
      <figcaption className="flex flex-wrap gap-x-6 gap-y-1 text-sm">
        {curves.map((c) => (
          <span key={c.label} className="inline-flex items-center gap-2">
            <svg viewBox="0 0 32 8" className="h-2 w-8" aria-hidden="true">
              <line x1={0} x2={32} y1={4} y2={4} className={toneClass[c.tone]} strokeWidth={3} strokeDasharray={c.tone === 'before' ? '7 4' : undefined} />
            </svg>
            {c.label}
          </span>
        ))}
      </figcaption>
    </figure>
  );
}
