import { useId, useState } from 'react';
import { Save } from 'lucide-react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { InputField } from '../../../components/ui/field';
import { useEditor, usePlanEditor } from '../hooks/use-plan-editor';

/**
 * "Save revision": the working copy becomes a new, unchangeable revision, with an optional short summary
 * (the server writes one from the changes when it is left empty).
 */
export function SaveRevisionControl() {
  const { saver } = usePlanEditor();
  const changed = useEditor((s) => s.plan !== s.basePlan);
  const saving = useEditor((s) => s.status.state === 'saving');
  const [open, setOpen] = useState(false);
  const [summary, setSummary] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const panelId = useId();

  const save = async () => {
    setBusy(true);
    setError(null);
    const result = await saver.saveRevision(summary);
    setBusy(false);
    if (result.ok) {
      setOpen(false);
      setSummary('');
    } else if (result.conflict) {
      // The conflict dialog takes it from here.
      setOpen(false);
    } else {
      setError(result.message);
    }
  };

  if (!open) {
    return (
      <Button onClick={() => setOpen(true)} disabled={!changed && !saving} aria-expanded={false} aria-controls={panelId}>
        <Save aria-hidden="true" className="size-5" />
        Save revision
      </Button>
    );
  }
  return (
    <form
      id={panelId}
      className="flex w-full flex-col gap-3 rounded-xl border-2 border-primary bg-surface p-4 sm:w-auto sm:min-w-96"
      onSubmit={(event) => {
        event.preventDefault();
        void save();
      }}
    >
      <InputField
        label="What changed (optional)"
        hint="A few words for the history, e.g. “Offsets from the designer’s sheet 2”."
        maxLength={500}
        value={summary}
        onChange={(event) => setSummary(event.target.value)}
        autoFocus
      />
      {error && <Alert tone="error">{error}</Alert>}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={busy}>
          <Save aria-hidden="true" className="size-5" />
          Save revision
        </Button>
        <Button variant="secondary" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
