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
