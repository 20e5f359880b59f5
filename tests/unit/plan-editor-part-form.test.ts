import { describe, expect, it } from 'vitest';
import { partFormSchema, partToForm, formPathOf } from '../../src/features/plan/components/frames/part-form-model';
import { addableKinds, newPart, partOfKind } from '../../src/features/plan/editor/part-defaults';
import { plan } from './plan-editor-fixtures';

describe('the frames form and the part', () => {
  it.each(addableKinds)('gives back the same %s through the form', (kind) => {
    const part = newPart(plan(), kind)!;
    const parsed = partFormSchema(part).safeParse(partToForm(part));
    expect(parsed.success && parsed.data).toEqual(part);
  });

  it('shows a transom’s rake and the saw limit in degrees and stores radians', () => {
    const p = plan();
    const transom = partOfKind(p, 'transom', { id: 'pt-t', name: 'Transom', stationId: 'st-3', thicknessMm: 18, layers: [{ thicknessMm: 18, material: 'plywood', densityKgPerM3: null, joints: { by: 'count', pieces: 1 } }] });
    const values = { ...partToForm(transom), rakeDeg: '12', bevelMarks: { everyMm: '40', sawTiltLimitDeg: '30' } };
    const parsed = partFormSchema(transom).safeParse(values);
    if (!parsed.success) throw new Error(parsed.error.message);
    expect(parsed.data.kind === 'transom' && parsed.data.rakeRad).toBeCloseTo((12 * Math.PI) / 180, 12);
    expect(parsed.data.bevelMarks).toEqual({ everyMm: 40, sawTiltLimitRad: Math.PI / 6 });
    expect(partToForm(parsed.data).rakeDeg).toBe('12');
  });

  it('names what is wrong at the form field it belongs to, in degrees where the person typed degrees', () => {
    const part = newPart(plan(), 'transom')!;
    const parsed = partFormSchema(part).safeParse({ ...partToForm(part), rakeDeg: '85', thicknessMm: 'twelve' });
    expect(parsed.success).toBe(false);
    const issues = parsed.success ? [] : parsed.error.issues.map((i) => [formPathOf(i.path), i.message]);
    expect(issues).toEqual([
      ['thicknessMm', 'the frame thickness (mm) must be a number, found "twelve"'],
      ['rakeDeg', 'The rake must be less than 80 degrees from the vertical, found 85'],
    ]);
  });

  it('passes the shared schema’s own checks across fields through: layers that do not add up', () => {
    const part = newPart(plan(), 'bulkhead')!;
    const parsed = partFormSchema(part).safeParse({ ...partToForm(part), thicknessMm: '15' });
    expect(parsed.success).toBe(false);
    const issue = parsed.success ? null : parsed.error.issues[0]!;
    expect(formPathOf(issue!.path)).toBe('layersTotal');
    expect(issue!.message).toContain('the layers add up to 12 mm but the frame is 15 mm thick');
  });
});
