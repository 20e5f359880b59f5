import { Group, Layer, Line, Rect, Stage, Text } from 'react-konva';
import type Konva from 'konva';
import type { ArrangementPiece } from '../../../../shared/api/exports';
import { type SheetLayout, type SheetLayoutPlacement, sheetPieceSize } from '../../../../shared/geometry/sheet-layout';
import { SHEET_VIEW_GAP_PX as GAP, SHEET_VIEW_TOP_PX as TOP, sheetViewScale } from './sheet-view-scale';
import { useElementWidth } from './tile-preview';

/** A piece's outline inside its box as placed (px from the box's top left), turned a quarter turn counter-clockwise when `rotated`, as the cut list draws it. */
function outlinePx(piece: ArrangementPiece, rotated: boolean, k: number): number[] {
  const along = sheetPieceSize(piece, rotated).alongMm;
  return piece.outline.flatMap((p) => (rotated ? [(piece.heightMm - p.z) * k, (along - p.y) * k] : [p.y * k, (along - p.z) * k]));
}

export interface SheetViewProps {
  layout: SheetLayout;
  pieces: readonly ArrangementPiece[];
  selectedId: string | null;
  /** Pieces breaking a rule where they lie now, or where one is being dragged to: drawn red. */
  flagged: ReadonlySet<string>;
  editable: boolean;
  onSelect: (pieceId: string) => void;
  /** While dragging: where the piece would go (the screen checks it live). */
  onDragTo: (placement: SheetLayoutPlacement) => void;
  /** On release: the move asked for; the screen accepts or refuses it (refused: the piece goes back). */
  onDrop: (placement: SheetLayoutPlacement) => boolean;
}

/** The sheets of one arrangement with every piece on them; pieces are dragged to another place or sheet. */
export function SheetView({ layout, pieces, selectedId, flagged, editable, onSelect, onDragTo, onDrop }: SheetViewProps) {
  const { ref, width } = useElementWidth<HTMLDivElement>(900);
  const v = sheetViewScale(layout, width);
  const byId = new Map(pieces.map((p) => [p.id, p]));
  const sheetIndex = new Map(layout.sheets.map((s, i) => [s.sheetNo, i]));

  /** The placement a piece's box at (px, py) on the stage stands for: the sheet under its middle, mm from that sheet's lower left corner. */
  const placementAt = (pl: SheetLayoutPlacement, node: Konva.Node): SheetLayoutPlacement => {
    const size = sheetPieceSize(byId.get(pl.pieceId)!, pl.rotated);
    const mid = node.x() + (size.acrossMm * v.k) / 2;
    let index = layout.sheets.findIndex((_, i) => mid >= v.sheetLeft(i) - GAP / 2 && mid < v.sheetLeft(i) + v.W * v.k + GAP / 2);
    if (index < 0) index = sheetIndex.get(pl.sheetNo) ?? 0;
    const x = (node.x() - v.sheetLeft(index)) / v.k;
    const y = (TOP + v.L * v.k - node.y()) / v.k - size.alongMm;
    return { ...pl, sheetNo: layout.sheets[index]!.sheetNo, x: Math.round(x), y: Math.round(y) };
  };

  return (
    <div ref={ref} className="w-full overflow-x-auto">
      <Stage width={v.widthPx} height={v.heightPx}>
        <Layer>
          {layout.sheets.map((s, i) => (
            <Group key={`sheet-${s.sheetNo}`} listening={false}>
              <Rect x={v.sheetLeft(i)} y={TOP} width={v.W * v.k} height={v.L * v.k} fill="#f3ead8" stroke="#6b5a3a" strokeWidth={1.5} />
              <Text x={v.sheetLeft(i)} y={4} width={v.W * v.k} align="center" fontStyle="bold" fontSize={14} fill="#333333" text={`Sheet ${s.sheetNo}, ${s.plyThicknessMm} mm`} />
            </Group>
          ))}
          {layout.placements.map((pl) => {
            const piece = byId.get(pl.pieceId);
            const i = sheetIndex.get(pl.sheetNo);
            if (!piece || i === undefined) return null;
            const size = sheetPieceSize(piece, pl.rotated);
            const w = size.acrossMm * v.k;
            const h = size.alongMm * v.k;
            const x = v.sheetLeft(i) + pl.x * v.k;
            const y = TOP + (v.L - pl.y - size.alongMm) * v.k;
            const bad = flagged.has(pl.pieceId);
            const selected = selectedId === pl.pieceId;
            return (
              <Group
                key={pl.pieceId}
                x={x}
                y={y}
                draggable={editable}
                onMouseDown={() => onSelect(pl.pieceId)}
                onTap={() => onSelect(pl.pieceId)}
                onDragMove={(e) => onDragTo(placementAt(pl, e.target))}
                onDragEnd={(e) => {
                  if (!onDrop(placementAt(pl, e.target))) e.target.position({ x, y });
                }}
              >
                <Rect width={w} height={h} fill={bad ? '#f7d4d4' : selected ? '#d8e6fb' : '#fffdf7'} stroke={bad ? '#b00000' : selected ? '#1f5fbf' : '#7a7a7a'} strokeWidth={bad || selected ? 2.5 : 1} dash={[4, 3]} />
                {piece.outline.length > 2 && <Line points={outlinePx(piece, pl.rotated, v.k)} closed stroke={bad ? '#b00000' : '#111111'} strokeWidth={1.2} />}
                <PieceLabel w={w} h={h} text={`${piece.partName} L${piece.layerIndex} #${piece.pieceNo}${pl.rotated ? ' (turned)' : ''}`} short={`#${piece.pieceNo}`} />
              </Group>
            );
          })}
        </Layer>
      </Stage>
    </div>
  );
}

/** A piece's name across its box, or up it (read from below) when the box is tall and too narrow for the words. */
function PieceLabel({ w, h, text, short }: { w: number; h: number; text: string; short: string }) {
  const fontSize = 12;
  // A box too small for any words says only its number; the piece list below names it in full.
  if (Math.max(w, h) < text.length * 6) return <Text width={w} y={h / 2 - 5} align="center" fontSize={Math.max(7, Math.min(10, w / 3))} fontStyle="bold" fill="#222222" text={short} />;
  const upright = w < text.length * fontSize * 0.55 && h > w;
  if (!upright) return <Text width={w} y={h / 2 - fontSize} align="center" fontSize={Math.max(9, Math.min(fontSize, w / 9))} fontStyle="bold" fill="#222222" text={text} />;
  return <Text x={w / 2 - fontSize / 2} y={h} width={h} rotation={-90} align="center" fontSize={Math.max(8, Math.min(fontSize, w * 0.6))} fontStyle="bold" fill="#222222" text={text} wrap="none" ellipsis />;
}
