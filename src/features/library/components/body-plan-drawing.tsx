import { useId } from 'react';
import type { LinesDrawing } from '../../../../shared/api/library';

const W = 640;
const H = 420;
const M = 28;

/**
 * The body plan: the section at every station, starboard half, true to scale, the two sets of lines
 * drawn over each other (the hull's now dashed, the other solid). A station one set lacks is drawn once.
 */
export function BodyPlanDrawing({ drawing, title, beforeLabel, afterLabel }: { drawing: LinesDrawing; title: string; beforeLabel: string; afterLabel: string | null }) {
  const titleId = useId();
  const all = drawing.stations.flatMap((s) => [...(s.before ?? []), ...(s.after ?? [])]);
  const maxY = Math.max(1, ...all.map((p) => p.y));
  const maxZ = Math.max(1, ...all.map((p) => p.z));
  const minZ = Math.min(0, ...all.map((p) => p.z));
  const scale = Math.min((W - 2 * M) / maxY, (H - 2 * M) / (maxZ - minZ));
  const px = (y: number) => M + y * scale;
  const pz = (z: number) => H - M - (z - minZ) * scale;
  const path = (points: { y: number; z: number }[]) => points.map((p, i) => `${i ? 'L' : 'M'}${px(p.y).toFixed(1)} ${pz(p.z).toFixed(1)}`).join(' ');

  return (
    <figure className="flex flex-col gap-2">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby={titleId} className="w-full max-w-3xl rounded-lg border border-rule bg-surface">
        <title id={titleId}>{title}</title>
        <line x1={px(0)} x2={px(0)} y1={M - 10} y2={H - M + 6} className="stroke-mark" strokeWidth={1.5} strokeDasharray="6 4" />
        <line x1={px(0)} x2={W - M} y1={pz(0)} y2={pz(0)} className="stroke-rule" strokeWidth={1.5} />
        {drawing.stations.map((s) => (
          <g key={`${s.name}-${s.x}`}>
            {s.before && <path d={path(s.before)} fill="none" className="stroke-edge" strokeWidth={2} strokeDasharray={afterLabel ? '8 5' : undefined} />}
            {afterLabel && s.after && <path d={path(s.after)} fill="none" className="stroke-primary" strokeWidth={2.5} />}
          </g>
        ))}
        <text x={W - M} y={H - 8} textAnchor="end" className="fill-muted text-[13px]">
          starboard half, true to scale
        </text>
      </svg>
      <figcaption className="flex flex-wrap gap-x-6 gap-y-1 text-sm">
        <span>{beforeLabel}{afterLabel ? ' (dashed)' : ''}</span>
        {afterLabel && <span>{afterLabel} (solid)</span>}
      </figcaption>
    </figure>
  );
}
