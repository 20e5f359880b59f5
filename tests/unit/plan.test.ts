import { describe, expect, it } from 'vitest';
import { documentUpgrade, planEmpty, planRead, type PlanUpgradeStep } from '../../shared/geometry/plan';
import { planChangeSummary, planCompare, planTouches } from '../../shared/geometry/plan-compare';
import { demoPlan } from '../../server/seed/demo-plan';

describe('planRead', () => {
  it('reads a current document as it is', () => {
    const read = planRead(JSON.parse(JSON.stringify(demoPlan())));
    expect(read).toEqual({ ok: true, plan: demoPlan(), upgradedFrom: null });
  });

  it('applies upgrade steps in order from the document version to the current one', () => {
    // A made-up history (versions 1 → 2 → 3) to check the mechanism: v1 kept the stations under `st`,
    // v2 kept the skin thickness under `skinMm`. Steps listed out of order on purpose.
    const steps: PlanUpgradeStep[] = [
      { from: 2, upgrade: ({ skinMm, ...rest }) => ({ ...rest, skin: { defaultThicknessMm: skinMm } }) },
      { from: 1, upgrade: ({ st, ...rest }) => ({ ...rest, stations: st, skinMm: 6 }) },
    ];
    expect(documentUpgrade({ schemaVersion: 1, st: ['a'] }, steps, 3)).toEqual({ ok: true, from: 1, doc: { schemaVersion: 3, stations: ['a'], skin: { defaultThicknessMm: 6 } } });
    expect(documentUpgrade({ schemaVersion: 2, stations: [], skinMm: 9 }, steps, 3)).toEqual({ ok: true, from: 2, doc: { schemaVersion: 3, stations: [], skin: { defaultThicknessMm: 9 } } });
    expect(documentUpgrade({ schemaVersion: 3, stations: [] }, steps, 3)).toEqual({ ok: true, from: 3, doc: { schemaVersion: 3, stations: [] } });
    expect(documentUpgrade({ schemaVersion: 1 }, steps.slice(0, 1), 3)).toMatchObject({ ok: false, issues: [{ message: 'no upgrade from schema version 1' }] });
  });

  it('refuses a document from a newer Loftbench, one without a version, and one that is not an object', () => {
    expect(planRead({ ...demoPlan(), schemaVersion: 2 })).toMatchObject({ ok: false, issues: [{ field: 'schemaVersion', message: expect.stringMatching(/newer Loftbench/) }] });
    expect(planRead({ lines: {} })).toMatchObject({ ok: false, issues: [{ field: 'schemaVersion' }] });
    expect(planRead([1, 2])).toMatchObject({ ok: false });
  });

  it('names the field of an invalid document', () => {
    const bad = JSON.parse(JSON.stringify(demoPlan()));
    bad.lines.stations[2].x = 'far';
    expect(planRead(bad)).toMatchObject({ ok: false, issues: [{ field: 'lines.stations.2.x' }] });
  });

  it('makes an empty plan in the hull units', () => {
    expect(planEmpty('ftin').lines.notation).toMatchObject({ unit: 'ftin', precision: '1/16in' });
    expect(planEmpty().parts).toEqual({ longitudinals: [], parts: [] });
  });
});

describe('planCompare', () => {
  it('lists a moved station, a changed cell, a changed setting and a renamed part in plain words', () => {
    const a = demoPlan();
    const b = demoPlan();
    b.lines.stations[1].x = 1010;
    (b.lines.lines[1].cells as Record<string, { y: number; z: number }>)['st-2'] = { y: 641, z: 190 };
    b.lines.skin.defaultThicknessMm = 4;
    b.parts.parts[0].name = 'Frame three';
    const changes = planCompare(a, b);
    expect(changes.map((c) => c.label)).toEqual(['station St 1 x', 'Chine at St 2', 'setting skin.defaultThicknessMm', 'part Frame three name']);
    expect(planTouches(a, b)).toEqual({ lines: true, parts: true });
    expect(planChangeSummary(changes)).toBe('1 station change, 1 offset, 1 setting, 1 part change changed');
  });

  it('compares as JSON documents do: key order and undefined properties are no change, a value deep in a part is one', () => {
    // Analytic cases of JSON equality (RFC 8259: an object is an unordered set of members; JSON.stringify
    // leaves out a property whose value is undefined).
    const a = demoPlan();
    const reordered = demoPlan();
    const part = reordered.parts.parts[0];
    reordered.parts.parts[0] = Object.assign(Object.fromEntries(Object.entries(part).reverse()), { notAField: undefined }) as unknown as typeof part;
    expect(planCompare(a, reordered)).toEqual([]);
    expect(planTouches(a, reordered)).toEqual({ lines: false, parts: false });

    const deeper = demoPlan();
    deeper.parts.parts[0].layers[1].thicknessMm = 12;
    expect(planCompare(a, deeper).map((c) => [c.path, c.before, c.after])).toEqual([[`parts.parts.${part.id}.layers.1.thicknessMm`, 9, 12]]);
    const dropped = demoPlan();
    dropped.parts.parts[0].layers.pop();
    expect(planCompare(a, dropped).map((c) => c.path)).toContain(`parts.parts.${part.id}.layers.1.thicknessMm`);
  });

  it('finds nothing between equal plans, and says so', () => {
    expect(planCompare(demoPlan(), demoPlan())).toEqual([]);
    expect(planTouches(demoPlan(), demoPlan())).toEqual({ lines: false, parts: false });
    expect(planChangeSummary([])).toBe('No changes');
  });
});
