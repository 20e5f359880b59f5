import { describe, expect, it } from 'vitest';
import { deckLineAt } from '../../shared/geometry/deck';
import { deductionOf } from '../../shared/geometry/deduction';
import { hullBuild } from '../../shared/geometry/hull';
import { sectionAt } from '../../shared/geometry/section';
import { GeometryInputError } from '../../shared/geometry/types';
import { chineHull, evenStations } from './analytic-hulls';
import { expectClose } from './helpers';

// Analytic: a box hull, half-beam 600 mm, vertical sides (side skin 9 mm), the sheer rising aft in a straight
// line z = 500 + 0.04 x (sweep). Deck: parabolic camber, crown 4 % of the beam = 48 mm over the 1200 mm beam,
// one pattern (every station has the same beam, so the pattern is the station's own curve); deck 12 mm.
// Deck top Z(x, y) = 500 + 0.04 x + 48 (1 - (y/600)^2), so dZ/dx = 0.04 everywhere: the deck's fore-and-aft
// slope is the sheer's sweep. The deck's in-plane normal n = (-dZ/dy, 1)/sqrt(1 + (dZ/dy)^2) moves up at 0.04 n_z
// per mm of x: the deck-edge bevel is atan(0.04 n_z), and the thickness set in along n is 12 sqrt(1 + (0.04 n_z)^2).
const lines = {
  ...chineHull({ xs: evenStations(0, 3000, 5), chineY: () => 600, flare: 0, sheerZ: (x: number) => 500 + 0.04 * x, bottomMm: 12, sideMm: 9 }),
  deck: { camber: { shape: 'parabola' as const, crown: { kind: 'percent-of-beam' as const, percent: 4 } }, thicknessMm: 12 },
};
const hull = hullBuild(lines);
const Z = (x: number, y: number) => 500 + 0.04 * x + 48 * (1 - (y / 600) ** 2);
const dZdy = (y: number) => (-96 * y) / 600 ** 2;

/** The exact underside point reached from the top at half-breadth y (mm). */
function underside(x: number, y: number): { y: number; z: number } {
  const m = dZdy(y);
  const len = Math.sqrt(1 + m * m);
  const ny = -m / len;
  const nz = 1 / len;
  const t = 12 * Math.sqrt(1 + (0.04 * nz) ** 2);
  return { y: y - ny * t, z: Z(x, y) - nz * t };
}

describe('deckLineAt', () => {
  it('follows the camber from the sheer up to the crown, its underside the thickness below', () => {
    const x = 1200;
    const deck = deckLineAt(hull, sectionAt(hull, x)!)!;
    // Beyond the beam's end (y > 600, reached so the underside surely meets the hull edge) the curve's end
    // tangent carries on, so only the beam itself is compared.
    for (const p of deck.top) if (p.y <= 600) expectClose(p.z, Z(x, p.y), 1e-9, `top at y = ${p.y}`);
    // Analytic: at the centreline the normal is vertical: the underside is 12 sqrt(1 + 0.04^2) below the crown.
    expectClose(deck.underside[0]!.z, Z(x, 0) - 12 * Math.sqrt(1 + 0.04 ** 2), 1e-9, 'underside at the centreline');
    for (const [i, p] of deck.top.entries()) {
      const q = underside(x, p.y);
      if (p.y > 600) continue;
      expectClose(deck.underside[i]!.y, q.y, 1e-6, `underside y at ${p.y}`);
      expectClose(deck.underside[i]!.z, q.z, 1e-6, `underside z at ${p.y}`);
    }
  });

  it('bevels the deck edge by the sheer sweep', () => {
    const deck = deckLineAt(hull, sectionAt(hull, 1200)!)!;
    for (const p of deck.underside) {
      // Analytic: rate = dZ/dx n_z = 0.04 n_z; the sweep is a straight line, so the central difference is exact.
      expectClose(p.rate, 0.04 * p.nz, 1e-9, `rate at y = ${p.y}`);
      expectClose(p.bevel, Math.atan(0.04 * p.nz), 1e-9, `bevel at y = ${p.y}`);
    }
  });

  it('meets the hull edge at the top corner of the outline', () => {
    const x = 1200;
    const d = deductionOf(hull, sectionAt(hull, x)!);
    const corner = d.outline.filter((p) => p.corner && p.z > 400);
    expect(corner.map((p) => p.edge).sort()).toEqual(['deck', 'hull']);
    // Analytic: the inner side is y = 600 - 9; find the top half-breadth whose underside point lands there.
    let lo = 500;
    let hi = 600;
    for (let k = 0; k < 80; k++) {
      const mid = (lo + hi) / 2;
      if (underside(x, mid).y < 591) lo = mid;
      else hi = mid;
    }
    const exact = underside(x, (lo + hi) / 2);
    expectClose(corner[0]!.y, 591, 1e-6, 'corner y');
    // The underside between its flattened points is a chord: within the 0.05 mm chord tolerance of the curve.
    expectClose(corner[0]!.z, exact.z, 0.05, 'corner z');
    // The outline runs back to the centreline along the underside.
    const last = d.outline[d.outline.length - 1]!;
    expect(last.edge).toBe('deck');
    expect(last.y).toBe(0);
  });

  it('is null without a deck', () => {
    const bare = hullBuild({ ...lines, deck: null });
    expect(deckLineAt(bare, sectionAt(bare, 1200)!)).toBeNull();
  });

  it('refuses a one-pattern camber narrower than the hull, naming the station', () => {
    // The camber API (camber.ts): one pattern serves only beams up to the one it is cut for.
    const narrow = { ...lines, deck: { camber: { shape: 'parabola' as const, crown: { kind: 'rise' as const, riseMm: 40, referenceBeamMm: 1000 } }, thicknessMm: 12 } };
    try {
      hullBuild(narrow);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(GeometryInputError);
      const issue = (e as GeometryInputError).issues[0]!;
      expect(issue.code).toBe('camber-station-wider-than-pattern');
      expect(issue.stationId).toBe('st0');
    }
  });
});
