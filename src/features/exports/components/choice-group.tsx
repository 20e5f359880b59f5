/** A set of radio buttons as big targets (48 px), under a legend that names the choice. */
export function ChoiceGroup({ legend, name, value, options, onChange, inline = false }: { legend: string; name: string; value: string; options: readonly { value: string; label: string }[]; onChange: (value: string) => void; inline?: boolean }) {
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-1 font-semibold">{legend}</legend>
      <div className={inline ? 'flex flex-wrap gap-2' : 'flex flex-col gap-2'}>
        {options.map((o) => (
          <label key={o.value} className={`flex min-h-12 cursor-pointer items-center gap-3 rounded-lg border-2 px-3 ${o.value === value ? 'border-primary bg-primary-soft' : 'border-edge bg-surface'}`}>
            <input type="radio" className="size-5" name={name} value={o.value} checked={o.value === value} onChange={() => onChange(o.value)} />
            <span>{o.label}</span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}
