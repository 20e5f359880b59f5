import type { BuildStage } from '../../../../shared/api/build-log';

export const stageLabels: Record<BuildStage, string> = {
  patterned: 'Patterned',
  cut: 'Cut',
  laminated: 'Laminated',
  shaped: 'Shaped',
  'test-fitted': 'Test-fitted',
  tacked: 'Tacked',
  filleted: 'Filleted',
  taped: 'Taped',
  glassed: 'Glassed',
};

export const epoxyCaution = 'Epoxy and hardener sensitise skin: wear nitrile gloves and eye protection, and keep the shop ventilated.';
export const sawCaution = 'At the saw or router: guards on, push sticks for narrow pieces, eye and hearing protection.';

/** "Layer 2 · 9 mm": layers are counted from 1 on the marked face, as the templates number them. */
export function layerLabel(layer: { index: number; thicknessMm: number }): string {
  return `Layer ${layer.index + 1} · ${layer.thicknessMm} mm`;
}

/** Where a flag's movement was measured, for the words beside it. */
export function flagWhere(flag: { layerIndex: number | null }): string {
  return flag.layerIndex === null ? '' : ` (layer ${flag.layerIndex + 1})`;
}
