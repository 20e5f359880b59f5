import { useLayoutEffect, useRef, useState } from 'react';
import { Layer, Line, Rect, Stage, Text } from 'react-konva';
import { drawingPathPoints, type DrawingPathRole } from '../../../../shared/geometry/drawing';
import type { Bounds } from '../../../../shared/geometry/polygon';
import type { Tile, TiledPrintPlan } from '../../../../shared/geometry/tiling';

/** Width (px) the element has, followed as the window changes. */
export function useElementWidth<T extends HTMLElement>(fallback: number) {
  const ref = useRef<T>(null);
  const [width, setWidth] = useState(fallback);
  useLayoutEffect(() => {
    const el = ref.current;
    if (!el) return;
    const measure = () => setWidth(Math.max(200, Math.floor(el.clientWidth)));
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return { ref, width };
}

const STYLE: Partial<Record<DrawingPathRole, { stroke: string; width: number; dash?: number[] }>> = {
  'outer-cut': { stroke: '#111111', width: 1.6 },
  'inner-cut': { stroke: '#111111', width: 1.6 },
  'other-face': { stroke: '#555555', width: 1, dash: [6, 4] },
};
const REFERENCE = { stroke: '#8a8a8a', width: 0.8, dash: [2, 3] };

/**
 * Each sheet's own cell on the map: the grid split at the middle of every overlap, as on the PDF's
 * assembly map, so that the cells tile the covered area without gaps.
 */
export function tileCell(plan: TiledPrintPlan, tile: Tile): Bounds {
  const { grid } = plan;
  const c = grid.covered;
  const o = grid.overlapMm / 2;
  return {
    minY: tile.col === 0 ? c.minY : tile.window.minY + o,
    maxY: tile.col === grid.cols - 1 ? c.maxY : tile.window.maxY - o,
    maxZ: tile.row === 0 ? c.maxZ : tile.window.maxZ - o,
    minZ: tile.row === grid.rows - 1 ? c.minZ : tile.window.minZ + o,
  };
}

/**
 * The part reduced to fit, with the tile grid of the print over it: printed sheets outlined and named
 * with their page, sheets left out (nothing on them) greyed. Millimetres become pixels only here.
 */
export function TilePreview({ plan, maxHeightPx = 520 }: { plan: TiledPrintPlan; maxHeightPx?: number }) {
  const { ref, width } = useElementWidth<HTMLDivElement>(640);
  const c = plan.grid.covered;
  const k = Math.min((width - 2) / (c.maxY - c.minY), maxHeightPx / (c.maxZ - c.minZ));
  const height = Math.ceil((c.maxZ - c.minZ) * k) + 2;
  const px = (y: number, z: number): [number, number] => [(y - c.minY) * k + 1, (c.maxZ - z) * k + 1];
  const printed = new Set(plan.printed.map((t) => t.name));
  const pageOf = new Map(plan.printed.map((t, i) => [t.name, plan.introPages + i + 1]));
  return (
    <div ref={ref} className="w-full">
      <Stage width={width} height={height}>
        <Layer listening={false}>
          {plan.grid.tiles.map((tile) => {
            const b = tileCell(plan, tile);
            const [x0, y0] = px(b.minY, b.maxZ);
            const [x1, y1] = px(b.maxY, b.minZ);
            return <Rect key={`cell-${tile.name}`} x={x0} y={y0} width={x1 - x0} height={y1 - y0} fill={printed.has(tile.name) ? '#ffffff' : '#e4e4e4'} />;
          })}
          {plan.seen.paths.map((path, i) => {
            const { points, closed } = drawingPathPoints(path, 0.5);
            const s = STYLE[path.role] ?? REFERENCE;
            return <Line key={`path-${i}`} points={points.flatMap((p) => px(p.y, p.z))} closed={closed} stroke={s.stroke} strokeWidth={s.width} dash={s.dash} />;
          })}
          {plan.grid.tiles.map((tile) => {
            const b = tileCell(plan, tile);
            const [x0, y0] = px(b.minY, b.maxZ);
            const [x1, y1] = px(b.maxY, b.minZ);
            const on = printed.has(tile.name);
            const size = Math.max(10, Math.min(22, (y1 - y0) / 4, (x1 - x0) / 4));
            return [
              <Rect key={`edge-${tile.name}`} x={x0} y={y0} width={x1 - x0} height={y1 - y0} stroke="#1f5fbf" strokeWidth={1} />,
              <Text
                key={`name-${tile.name}`}
                x={x0}
                y={y0 + (y1 - y0) / 2 - size * 0.8}
                width={x1 - x0}
                align="center"
                fontStyle="bold"
                fontSize={size}
                fill={on ? '#1f5fbf' : '#9a9a9a'}
                text={on ? `${tile.name}\np. ${pageOf.get(tile.name)}` : tile.name}
              />,
            ];
          })}
        </Layer>
      </Stage>
    </div>
  );
}
