import { memo, useState } from 'react';
import type { Line } from '../../../../../shared/geometry/hull-schema';
import type { Notation } from '../../../../../shared/geometry/notation-schema';
import { ConfirmInline } from '../../../../components/ui/confirm-inline';
import { lineAdd, lineDelete, lineReorder, lineUpdate, panelsBoundedBy } from '../../editor/line-actions';
import { edit } from '../../editor/types';
import { useEditor, usePlanEditor } from '../../hooks/use-plan-editor';
import { ItemControls } from './item-controls';
import { pointRoleWords, rowHeaderDetail } from './grid-rows';
import { LineForm, lineFormValues } from './line-form';

const LineItem = memo(function LineItem({ line, index, count, notation }: { line: Line; index: number; count: number; notation: Notation }) {
  const { store } = usePlanEditor();
  const [mode, setMode] = useState<'view' | 'edit' | 'delete'>('view');
  const apply = store.getState().apply;
  const panels = panelsBoundedBy(store.getState().plan, line.id);
  return (
    <li className="flex flex-col gap-3 border-b border-rule py-3 last:border-b-0">
      <div className="flex flex-wrap items-center gap-3">
        <span className="min-w-16 font-semibold">{line.name}</span>
        <span className="text-muted">{line.kind === 'point' ? `${pointRoleWords[line.role]} · height and half-breadth` : rowHeaderDetail(line, 'value', notation)}</span>
        {line.knuckle && <span className="rounded border border-edge px-2 text-sm">knuckle</span>}
        <ItemControls
          name={line.name}
          index={index}
          count={count}
          runs="rows"
          onMove={(label, toIndex) => apply(edit(label, lineReorder, { lineId: line.id, toIndex }))}
          onChange={() => setMode('edit')}
          onDelete={() => setMode('delete')}
        />
      </div>
      {mode === 'edit' && (
        <LineForm
          notation={notation}
          initial={lineFormValues(line, notation)}
          fixedKind
          submitLabel="Save line"
          onCancel={() => setMode('view')}
          onSubmit={({ name, spec, knuckle }) => {
            const keep = knuckle ? (line.knuckle ?? { fromX: null, toX: null }) : null;
            apply(edit(`Change ${line.name}`, lineUpdate, { lineId: line.id, name, spec: line.kind === 'point' ? undefined : spec, knuckle: keep }));
            setMode('view');
          }}
        />
      )}
      {mode === 'delete' && (
        <ConfirmInline
          question={`Delete ${line.name} and all its offsets?${panels.length ? ` The skin panel${panels.length === 1 ? '' : 's'} ${panels.join(', ')}, bounded by it, go${panels.length === 1 ? 'es' : ''} too.` : ''} Undo brings it back.`}
          confirmLabel={`Yes, delete ${line.name}`}
          onCancel={() => setMode('view')}
          onConfirm={() => apply(edit(`Delete ${line.name}`, lineDelete, { lineId: line.id }))}
        />
      )}
    </li>
  );
});

/** The lines (the table's rows): add one of any kind with its fixed value, rename, reorder and delete. */
export function LinesPanel({ notation }: { notation: Notation }) {
  const { store } = usePlanEditor();
  const lines = useEditor((s) => s.plan.lines.lines);
  return (
    <section aria-labelledby="lines-list-heading" className="flex flex-col gap-3">
      <h3 id="lines-list-heading" className="text-xl font-bold">
        Lines
      </h3>
      {lines.length > 0 && (
        <ul className="rounded-xl border border-rule bg-surface px-4">
          {lines.map((line, index) => (
            <LineItem key={line.id} line={line} index={index} count={lines.length} notation={notation} />
          ))}
        </ul>
      )}
      <div className="rounded-xl border border-rule bg-surface p-4">
        <h4 className="mb-2 font-semibold">Add a line</h4>
        <LineForm
          key={`${lines.length}-${notation.unit}`}
          notation={notation}
          initial={{ kind: 'waterline', name: '', fixed: '', angle: '', knuckle: false }}
          fixedKind={false}
          submitLabel="Add line"
          onSubmit={({ name, spec, knuckle }) => {
            const state = store.getState();
            state.apply({
              label: `Add ${name}`,
              apply: (plan) => {
                const added = lineAdd(plan, { name, spec });
                const line = added.lines.lines[added.lines.lines.length - 1];
                return line && added !== plan ? lineUpdate(added, { lineId: line.id, knuckle: knuckle ? { fromX: null, toX: null } : null }) : added;
              },
            });
          }}
        />
      </div>
    </section>
  );
}
