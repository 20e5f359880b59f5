import { Label, Tag, Text } from 'react-konva';

/** Average width of a character of the app's sans face, as a share of its size (for placing a label before it is measured). */
const CHAR_WIDTH_EM = 0.56;
const PADDING_PX = 2;

export interface KonvaLabelProps {
  /** Screen px of the anchor. */
  x: number;
  y: number;
  text: string;
  /** px */
  size: number;
  colour: string;
  bold?: boolean;
  /** Which end of the text sits on the anchor. */
  align?: 'start' | 'centre' | 'end';
  /** Centre the text on the anchor vertically (else the anchor is its top). */
  middle?: boolean;
  /** Degrees anticlockwise about the anchor. */
  rotationDeg?: number;
}

/**
 * A label on the drawing, on a pale ground so it reads where it crosses a line. Labels never take the
 * pointer: the drawing under them still pans.
 */
export function KonvaLabel({ x, y, text, size, colour, bold = false, align = 'start', middle = false, rotationDeg = 0 }: KonvaLabelProps) {
  const width = text.length * size * CHAR_WIDTH_EM + 2 * PADDING_PX;
  const height = size * 1.2 + 2 * PADDING_PX;
  const offsetX = align === 'start' ? 0 : align === 'end' ? width : width / 2;
  return (
    <Label x={x} y={y} offsetX={offsetX} offsetY={middle ? height / 2 : 0} rotation={-rotationDeg} listening={false}>
      <Tag fill="rgba(255, 255, 255, 0.85)" cornerRadius={2} />
      <Text text={text} fontSize={size} fontFamily="Inter, ui-sans-serif, sans-serif" fontStyle={bold ? 'bold' : 'normal'} fill={colour} padding={PADDING_PX} />
    </Label>
  );
}
