/**
 * The cautions printed on patterns and tables (DESIGN.md section 6; REFERENCES.md, Safety and scantlings).
 * One place, so that every file says the same.
 */

/** Saws and routers. */
export const CAUTION_SAWS =
  'Saws and routers: keep the guards on, use push sticks (on a table saw whenever a hand comes within 150 mm of the blade), wear eye and hearing protection. Bandsaw: lock the table tilt and check it with a protractor; keep the upper guide close to the stock.';

/** Checking the print before any cut. */
export const CAUTION_SCALE = 'Before cutting, measure the check square on every sheet and the check dimension on the taped-up pattern. A pattern printed at the wrong scale makes a part that will not fit.';

/** Epoxy, for the fillets and tape the part takes. */
export const CAUTION_EPOXY = 'Epoxy and its hardeners sensitise skin, and the sensitivity lasts: wear gloves and eye protection, ventilate, never clean skin with solvent, and keep sanding dust of part-cured epoxy off your skin and out of your lungs.';

/** Structure: Loftbench draws; the designer and the rules decide. */
export const CAUTION_STRUCTURE =
  'Structure: Loftbench draws what it is told and does not certify scantlings. Frame sizes, spacing and ply thickness come from the designer and the rules that apply (ISO 12215 for small craft, or local codes).';

/** All four, in the order printed. */
export const CAUTIONS: readonly string[] = [CAUTION_SCALE, CAUTION_SAWS, CAUTION_EPOXY, CAUTION_STRUCTURE];
