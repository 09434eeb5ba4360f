import { useId, useState, type FormEvent } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { buildsWithoutCalls, patternValue, type Pattern } from '../../../../shared/analysis/pattern';
import { READ_ONLY_NOTE, type PatternListDto } from '../../../../shared/pattern-lists';
import { ApiError } from '../../../lib/api/client';
import { patternListExportUrl, useCopyPatternList, useDeletePatternList, usePatternList, useSavePatternList } from '../api/pattern-lists';
import { Button } from '../../../components/ui/Button';
import { DeleteConfirm } from '../../../components/ui/DeleteConfirm';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { DownloadLink } from '../../../components/ui/LinkButton';
import { PatternEditor } from '../components/PatternEditor';
import { PatternTiles } from '../components/PatternTiles';
import { TeacherOnly } from '../../../components/ui/TeacherOnly';
import { TextField } from '../../../components/ui/TextField';
import { patternsWord } from '../../../lib/phase-words';

/** Errors of pattern i, without the "patterns.<i>." prefix. */
function errorsOf(errors: Record<string, string>, i: number): Record<string, string> {
  const prefix = `patterns.${i}`;
  const out: Record<string, string> = {};
  for (const [key, message] of Object.entries(errors)) {
    if (key === prefix) out._ = message;
    else if (key.startsWith(`${prefix}.`)) out[key.slice(prefix.length + 1)] = message;
  }
  return out;
}

function freshPattern(patterns: Pattern[]): Pattern {
  let n = patterns.length + 1;
  const ids = new Set(patterns.map((p) => p.id));
  while (ids.has(`pattern-${String(n).padStart(2, '0')}`)) n++;
  return {
    id: `pattern-${String(n).padStart(2, '0')}`,
    name: '',
    family: 'practice',
    value: 50,
    sealed: false,
    groups: [
      { size: 2, tile: 'flower' },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 0 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 1 } },
      { size: 4, suit: 'A', rank: { var: 'n', offset: 2 } },
    ],
  };
}

function ReadOnlyList({ list }: { list: PatternListDto }) {
  const navigate = useNavigate();
  const copy = useCopyPatternList();
  return (
    <div className="flex flex-col gap-6">
      <p>
        <Link to="/pattern-lists">← All pattern lists</Link>
      </p>
      <h1 className="text-title font-semibold">{list.name}</h1>
      <p>{[list.description, READ_ONLY_NOTE].filter(Boolean).join(' ')}</p>
      <div className="flex flex-wrap gap-3">
        <Button kind="primary" disabled={copy.isPending} onClick={() => copy.mutate({ id: list.id }, { onSuccess: (made) => navigate(`/pattern-lists/${made.id}`) })}>
          Copy into a list of my own
        </Button>
        <DownloadLink href={patternListExportUrl(list.id, 'json')}>Download JSON</DownloadLink>
        <DownloadLink href={patternListExportUrl(list.id, 'csv')}>Download CSV</DownloadLink>
      </div>
      {copy.error && <FormMessage error>{copy.error.message}</FormMessage>}
      <ul className="flex flex-col gap-3">
        {list.patterns.map((p) => (
          <li key={p.id}>
            <Card className="flex flex-col gap-2">
              <h2 className="font-semibold">
                {p.name} <span className="font-normal text-ink-soft">· {p.family} · value {patternValue(p)}{buildsWithoutCalls(p) ? ' · sealed: build it from your own draws, no calls' : ''}</span>
              </h2>
              <PatternTiles groups={p.groups} />
            </Card>
          </li>
        ))}
      </ul>
    </div>
  );
}

function ListForm({ list }: { list?: PatternListDto }) {
  const navigate = useNavigate();
  const save = useSavePatternList(list?.id);
  const remove = useDeletePatternList();
  const [name, setName] = useState(list?.name ?? '');
  const [description, setDescription] = useState(list?.description ?? '');
  const [patterns, setPatterns] = useState<Pattern[]>(() => list?.patterns ?? [freshPattern([])]);
  const [open, setOpen] = useState<number | null>(list ? null : 0);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState('');
  const [saved, setSaved] = useState('');
  const descriptionId = useId();

  const onSubmit = (e: FormEvent) => {
    e.preventDefault();
    setProblem('');
    setSaved('');
    save.mutate(
      { name, description, patterns },
      {
        onSuccess: (l) => {
          setErrors({});
          setSaved(`Saved “${l.name}” with ${patternsWord(l.patternCount)}.`);
          if (!list) navigate(`/pattern-lists/${l.id}`, { replace: true });
        },
        onError: (err) => {
          const fields = err instanceof ApiError ? err.fields : {};
          setErrors(fields);
          setProblem(err.message);
          const first = Object.keys(fields).find((k) => k.startsWith('patterns.'));
          if (first) setOpen(Number(first.split('.')[1]));
        },
      },
    );
  };

  const setPattern = (i: number, p: Pattern) => setPatterns((all) => all.map((x, k) => (k === i ? p : x)));
  const removePattern = (i: number) => {
    setPatterns((all) => all.filter((_, k) => k !== i));
    setErrors({});
    setOpen(null);
  };

  return (
    <div className="flex flex-col gap-6">
      <p>
        <Link to="/pattern-lists">← All pattern lists</Link>
      </p>
      <h1 className="text-title font-semibold">{list ? `Pattern list: ${list.name}` : 'New pattern list'}</h1>
      {list && (
        <div className="flex flex-wrap gap-3">
          <DownloadLink href={patternListExportUrl(list.id, 'json')}>Download JSON</DownloadLink>
          <DownloadLink href={patternListExportUrl(list.id, 'csv')}>Download CSV</DownloadLink>
        </div>
      )}
      <form noValidate onSubmit={onSubmit} className="flex flex-col gap-6" aria-label={list ? 'Edit the pattern list' : 'New pattern list'}>
        {problem && <FormMessage error>{problem}</FormMessage>}
        <Card className="flex flex-col gap-4">
          <TextField label="List name" value={name} onChange={(e) => setName(e.target.value)} error={errors.name} />
          <div className="flex flex-col gap-1">
            <label htmlFor={descriptionId} className="font-medium">
              Description
            </label>
            <textarea id={descriptionId} rows={2} value={description} onChange={(e) => setDescription(e.target.value)} className="rounded-lg border-2 border-line bg-card px-3 py-2" />
            {errors.description && <p className="font-medium text-danger">✕ {errors.description}</p>}
          </div>
          {errors.patterns && <p className="font-medium text-danger">✕ {errors.patterns}</p>}
        </Card>
        <ol className="flex flex-col gap-3" aria-label="Patterns">
          {patterns.map((p, i) => {
            const own = errorsOf(errors, i);
            const bad = Object.keys(own).length > 0;
            const editing = open === i;
            return (
              <li key={i}>
                <Card className={`flex flex-col gap-3 ${bad ? 'border-2 border-danger' : ''}`}>
                  <div className="flex flex-wrap items-baseline justify-between gap-2">
                    <h2 className="font-semibold">
                      {i + 1}. {p.name || 'Unnamed pattern'} <span className="font-normal text-ink-soft">({p.id})</span>
                    </h2>
                    {bad && <span className="font-semibold text-danger">✕ Needs a look</span>}
                  </div>
                  {!editing && <PatternTiles groups={p.groups} size="w-7" />}
                  {!editing && bad && <p className="font-medium text-danger">{Object.values(own)[0]}</p>}
                  <div className="flex flex-wrap gap-3">
                    <Button onClick={() => setOpen(editing ? null : i)} aria-expanded={editing} aria-label={`${editing ? 'Close' : 'Edit'} pattern ${i + 1}`}>
                      {editing ? 'Close' : 'Edit'}
                    </Button>
                    <Button kind="quiet" onClick={() => removePattern(i)} aria-label={`Remove pattern ${i + 1}`}>
                      Remove
                    </Button>
                  </div>
                  {editing && <PatternEditor pattern={p} onChange={(next) => setPattern(i, next)} errors={own} />}
                </Card>
              </li>
            );
          })}
        </ol>
        <div className="flex flex-wrap gap-3">
          <Button
            onClick={() => {
              setPatterns((all) => [...all, freshPattern(all)]);
              setOpen(patterns.length);
            }}
          >
            Add a pattern
          </Button>
          <Button kind="primary" type="submit" disabled={save.isPending}>
            {save.isPending ? 'Saving…' : list ? 'Save the list' : 'Make the list'}
          </Button>
        </div>
        {saved && <FormMessage>{saved}</FormMessage>}
      </form>
      {list && (
        <DeleteConfirm
          label="Delete this list"
          question={`Delete “${list.name}”?`}
          onConfirm={() => remove.mutate(list.id, { onSuccess: () => navigate('/pattern-lists') })}
          pending={remove.isPending}
          error={remove.error}
        />
      )}
    </div>
  );
}

function Existing({ id }: { id: string }) {
  const list = usePatternList(id);
  if (list.isPending) return <p role="status">Loading the list…</p>;
  if (list.error) return <FormMessage error>{list.error.message}</FormMessage>;
  return list.data.readOnly ? <ReadOnlyList list={list.data} /> : <ListForm key={list.data.id} list={list.data} />;
}

export function PatternListEditPage() {
  const { id } = useParams();
  return <TeacherOnly what="Pattern lists">{id ? <Existing id={id} /> : <ListForm />}</TeacherOnly>;
}
