import { z } from 'zod';

/** Query of the tiled PDF: paper, orientation, the margin the printer cannot print in and the overlap (mm). */
export const tiledPdfQuerySchema = z.object({
  paper: z.enum(['a4', 'letter', 'a3', 'tabloid', 'custom']).default('a4'),
  widthMm: z.coerce.number().min(100).max(2000).optional(),
  heightMm: z.coerce.number().min(100).max(5000).optional(),
  orientation: z.enum(['portrait', 'landscape']).default('portrait'),
  marginMm: z.coerce.number().min(0).max(30).default(6.35),
  overlapMm: z.coerce.number().min(0).max(50).default(15),
  /** Ply layer, from 1; without it the first. */
  layer: z.coerce.number().int().min(1).max(16).default(1),
}).refine((q) => q.paper !== 'custom' || (q.widthMm !== undefined && q.heightMm !== undefined), { message: 'a custom paper needs widthMm and heightMm', path: ['widthMm'] });
export type TiledPdfQuery = z.input<typeof tiledPdfQuerySchema>;

/** Query of the one-sheet PDF for a copy shop or plotter. */
export const rollPdfQuerySchema = z.object({
  rollWidthMm: z.coerce.number().min(200).max(2000).default(914),
  layer: z.coerce.number().int().min(1).max(16).default(1),
});

/** Query of a DXF: units, and one layer (from 1) or, without it, every layer side by side. */
export const dxfQuerySchema = z.object({
  units: z.enum(['mm', 'in']).default('mm'),
  layer: z.coerce.number().int().min(1).max(16).optional(),
});

/** Query of the cut list: sheet size and saw kerf (mm). */
export const cutListQuerySchema = z.object({
  sheetWidthMm: z.coerce.number().min(300).max(3000).default(1220),
  sheetLengthMm: z.coerce.number().min(300).max(6000).default(2440),
  kerfMm: z.coerce.number().min(0).max(10).default(3),
});
