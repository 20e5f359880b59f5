import { useState, type FormEvent } from 'react';
import { buildSettingsSchema } from '../../../../shared/api/build-log';
import type { Notation } from '../../../../shared/geometry/notation-schema';
import { lengthFormat, lengthParse } from '../../../../shared/geometry/notation';
import { Button } from '../../../components/ui/button';
import { InputField } from '../../../components/ui/field';
import { ApiError, describeError } from '../../../lib/api-client';
import { useUpdateBuildSettings } from '../api/update-build-settings';

// A tolerance is small: show it to the finest step the hull's unit writes, so a saved 0.3 mm is not shown as 0.5.
const finest = (n: Notation): Notation => ({ ...n, precision: n.unit === 'mm' ? '0.1mm' : '1/32in' });

const hints: Record<Notation['unit'], string> = {
  mm: 'In millimetres, for example 1.5',
  in: 'In inches, for example 1/16',
  ftin: 'In feet-inches-eighths like 0-0-1, or inches like 1/16"',
};

/**
 * The text typed, read as a length in the hull's notation and checked with the schema the server uses:
 * the millimetres, or the message to show under the field.
 */
export function toleranceRead(text: string, notation: Notation): { ok: true; mm: number } | { ok: false; message: string } {
  const read = lengthParse(text, notation);
  if (read === null) return { ok: false, message: 'Enter the movement tolerance' };
  if (!read.ok) return read;
  const checked = buildSettingsSchema.safeParse({ moveToleranceMm: read.mm });
  if (!checked.success) {
    const mm = Math.round(read.mm * 100) / 100;
    return { ok: false, message: `${checked.error.issues[0]!.message}, found ${notation.unit === 'mm' ? `${mm} mm` : `"${text.trim()}" (${mm} mm)`}` };
  }
  return { ok: true, mm: checked.data.moveToleranceMm };
}

/** How far a later revision may move a cut part before the board flags it; the owner and builders set it. */
export function ToleranceForm({ hullId, toleranceMm, notation }: { hullId: number; toleranceMm: number; notation: Notation }) {
  const update = useUpdateBuildSettings(hullId);
  const [text, setText] = useState(() => lengthFormat(toleranceMm, finest(notation)));
  const [error, setError] = useState<string | undefined>();
  const [saved, setSaved] = useState(false);

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setSaved(false);
    const read = toleranceRead(text, notation);
    if (!read.ok) return setError(read.message);
    setError(undefined);
    try {
      await update.mutateAsync(read.mm);
      // Written back the way the board will show it ("2" becomes "2.0"), so the field says what was stored.
      setText(lengthFormat(read.mm, finest(notation)));
      setSaved(true);
    } catch (err) {
      setError(err instanceof ApiError && err.field === 'moveToleranceMm' ? err.message : describeError(err));
    }
  };

  return (
    <form onSubmit={(e) => void submit(e)} noValidate aria-label="Movement tolerance" className="flex max-w-xl flex-col gap-3 rounded-xl border-2 border-rule bg-surface p-4">
      <InputField
        label="Flag a cut part when a new revision moves it more than"
        hint={hints[notation.unit]}
        error={error}
        value={text}
        inputMode={notation.unit === 'mm' ? 'decimal' : 'text'}
        onChange={(e) => {
          setText(e.target.value);
          setSaved(false);
        }}
        className="text-lg"
      />
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" busy={update.isPending}>
          Save tolerance
        </Button>
        {saved && <span role="status">Saved. The board now flags against it.</span>}
      </div>
    </form>
  );
}
