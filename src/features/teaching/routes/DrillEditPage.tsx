import { useId, useState, type FormEvent } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import type { DrillDto, DrillInput, PresetRacks } from '../../../../shared/drills';
import { STARTER_LIST_ID } from '../../../../shared/pattern-lists';
import { ApiError } from '../../../lib/api/client';
import { drillExportUrl, useDeleteDrill, useDrill, useSaveDrill } from '../api/drills';
import { usePatternLists } from '../api/pattern-lists';
import { Button } from '../../../components/ui/Button';
import { DeleteConfirm } from '../../../components/ui/DeleteConfirm';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { DownloadLink } from '../../../components/ui/LinkButton';
import { RackPresetPicker } from '../components/RackPresetPicker';
import { TeacherOnly } from '../../../components/ui/TeacherOnly';
import { TextField } from '../../../components/ui/TextField';
import { OpenTableButton } from '../components/OpenTableButton';
import { CheckField } from '../../../components/ui/CheckField';
import { patternsWord } from '../../../lib/phase-words';

type Draft = Required<Omit<DrillInput, 'racks'>> & { racks: PresetRacks };

const blank: Draft = { name: '', description: '', seed: '', jokers: true, secondCharleston: true, courtesy: true, racks: {}, patternListId: STARTER_LIST_ID };

function draftOf(d: DrillDto): Draft {
  return { name: d.name, description: d.description, seed: d.seed, jokers: d.jokers, secondCharleston: d.secondCharleston, courtesy: d.courtesy, racks: d.racks, patternListId: d.patternListId };
}

/** A fresh seed from the name and a few random letters, so each new drill deals its own racks. */
function newSeed(name: string) {
  const stem = name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 40) || 'drill';
  return `${stem}-${Math.random().toString(36).slice(2, 8)}`;
}


function DrillForm({ drill }: { drill?: DrillDto }) {
  const navigate = useNavigate();
  const save = useSaveDrill(drill?.id);
  const remove = useDeleteDrill();
  const lists = usePatternLists();
  const [draft, setDraft] = useState<Draft>(() => (drill ? draftOf(drill) : blank));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState('');
  const [saved, setSaved] = useState('');
  const ids = { description: useId(), list: useId() };
  const set = (patch: Partial<Draft>) => {
    setDraft((d) => ({ ...d, ...patch }));
    setSaved('');
  };

  const onSubmit = (e: FormEvent) => {
    e.preventDefault();
    setProblem('');
    save.mutate(draft, {
      onSuccess: (d) => {
        setErrors({});
        setSaved(`Saved “${d.name}”.`);
        if (!drill) navigate(`/drills/${d.id}`, { replace: true });
      },
      onError: (err) => {
        setErrors(err instanceof ApiError ? err.fields : {});
        setProblem(err.message);
      },
    });
  };

  return (
    <div className="flex flex-col gap-6">
      <p>
        <Link to="/drills">← All drills</Link>
      </p>
      <h1 className="text-title font-semibold">{drill ? `Drill: ${drill.name}` : 'New drill'}</h1>
      {drill && (
        <div className="flex flex-wrap gap-3">
          <OpenTableButton drill={drill} />
          <DownloadLink href={drillExportUrl(drill.id)}>Download drill file</DownloadLink>
        </div>
      )}
      <form noValidate onSubmit={onSubmit} className="flex flex-col gap-6" aria-label={drill ? 'Edit the drill' : 'New drill'}>
        {problem && <FormMessage error>{problem}</FormMessage>}
        <Card className="flex flex-col gap-4">
          <h2 className="text-lead font-semibold">The drill and its deal</h2>
          <TextField label="Drill name" value={draft.name} onChange={(e) => set({ name: e.target.value })} error={errors.name} />
          <div className="flex flex-col gap-1">
            <label htmlFor={ids.description} className="font-medium">
              Description for students
            </label>
            <textarea
              id={ids.description}
              rows={3}
              value={draft.description}
              onChange={(e) => set({ description: e.target.value })}
              aria-invalid={errors.description ? true : undefined}
              aria-describedby={errors.description ? `${ids.description}-e` : undefined}
              className={`rounded-lg border-2 bg-card px-3 py-2 ${errors.description ? 'border-danger' : 'border-line'}`}
            />
            {errors.description && (
              <p id={`${ids.description}-e`} className="font-medium text-danger">
                ✕ {errors.description}
              </p>
            )}
          </div>
          <div className="flex flex-wrap items-end gap-3">
            <div className="min-w-0 flex-1">
              <TextField
                label="Deal seed"
                hint="The same seed deals the same racks every time, at every table."
                value={draft.seed}
                onChange={(e) => set({ seed: e.target.value })}
                error={errors.seed}
              />
            </div>
            <Button onClick={() => set({ seed: newSeed(draft.name) })}>New seed</Button>
          </div>
          <fieldset className="flex flex-col gap-3">
            <legend className="mb-1 font-semibold">Which parts run</legend>
            <CheckField label="Deal with jokers" hint="Off deals from the set without its 8 jokers." checked={draft.jokers} onChange={(jokers) => set({ jokers })} error={errors.jokers} />
            <CheckField
              label="Offer a second Charleston"
              hint="The first Charleston always runs; then the table votes on a second. Off stops after the first."
              checked={draft.secondCharleston}
              onChange={(secondCharleston) => set({ secondCharleston })}
              error={errors.secondCharleston}
            />
            <CheckField label="Offer the courtesy pass" hint="Seats across from each other may swap up to 3 tiles at the end." checked={draft.courtesy} onChange={(courtesy) => set({ courtesy })} error={errors.courtesy} />
          </fieldset>
          <div className="flex flex-col gap-1">
            <label htmlFor={ids.list} className="font-medium">
              Pattern list
            </label>
            <p className="text-base text-ink-soft">The list the table’s analysis and bots judge racks by.</p>
            <select
              id={ids.list}
              value={draft.patternListId}
              onChange={(e) => set({ patternListId: e.target.value })}
              aria-invalid={errors.patternListId ? true : undefined}
              aria-describedby={errors.patternListId ? `${ids.list}-e` : undefined}
              className={`min-h-12 rounded-lg border-2 bg-card px-3 ${errors.patternListId ? 'border-danger' : 'border-line'}`}
            >
              {(lists.data ?? [{ id: STARTER_LIST_ID, name: 'Starter list', patternCount: 0 }]).map((l) => (
                <option key={l.id} value={l.id}>
                  {l.name}
                  {l.patternCount ? ` (${patternsWord(l.patternCount)})` : ''}
                </option>
              ))}
              {drill && !lists.data?.some((l) => l.id === draft.patternListId) && draft.patternListId !== STARTER_LIST_ID && (
                <option value={draft.patternListId}>{drill.patternListName}</option>
              )}
            </select>
            {errors.patternListId && (
              <p id={`${ids.list}-e`} className="font-medium text-danger">
                ✕ {errors.patternListId}
              </p>
            )}
          </div>
        </Card>
        <Card className="flex flex-col gap-3">
          <h2 className="text-lead font-semibold">Racks at the deal</h2>
          <RackPresetPicker racks={draft.racks} jokers={draft.jokers} onChange={(racks) => set({ racks })} errors={errors} />
        </Card>
        {saved && <FormMessage>{saved}</FormMessage>}
        <div className="flex flex-wrap gap-3">
          <Button kind="primary" type="submit" disabled={save.isPending}>
            {save.isPending ? 'Saving…' : drill ? 'Save the drill' : 'Make the drill'}
          </Button>
        </div>
      </form>
      {drill && (
        <DeleteConfirm
          label="Delete this drill"
          question={`Delete “${drill.name}”? Tables already opened keep their deal.`}
          onConfirm={() => remove.mutate(drill.id, { onSuccess: () => navigate('/drills') })}
          pending={remove.isPending}
          error={remove.error}
        />
      )}
    </div>
  );
}

function EditExisting({ id }: { id: string }) {
  const drill = useDrill(id);
  if (drill.isPending) return <p role="status">Loading the drill…</p>;
  if (drill.error) return <FormMessage error>{drill.error.message}</FormMessage>;
  return <DrillForm key={drill.data.id} drill={drill.data} />;
}

export function DrillEditPage() {
  const { id } = useParams();
  return <TeacherOnly what="Drills">{id ? <EditExisting id={id} /> : <DrillForm />}</TeacherOnly>;
}
