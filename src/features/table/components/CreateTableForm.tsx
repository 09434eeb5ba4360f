import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import type { TableOptionsInput } from '../../../../shared/protocol';
import { useMe } from '../../../lib/api/auth';
import { ApiError } from '../../../lib/api/client';
import { createTableErrors, useCreateTable } from '../../../lib/api/tables';
import { Button } from '../../../components/ui/Button';
import { FormMessage } from '../../../components/ui/FormMessage';
import { TextField } from '../../../components/ui/TextField';
import { CheckField } from '../../../components/ui/CheckField';

/** The on-or-off options. */
type Switch = { [K in keyof TableOptionsInput]-?: NonNullable<TableOptionsInput[K]> extends boolean ? K : never }[keyof TableOptionsInput];
const SWITCHES: { key: Switch; label: string; hint: string; initial: boolean }[] = [
  { key: 'jokers', label: 'Deal with jokers', hint: 'Off deals from the set without its 8 jokers.', initial: true },
  { key: 'secondCharleston', label: 'Offer a second Charleston', hint: 'After the first, the table votes; off stops after the first.', initial: true },
  { key: 'courtesy', label: 'Offer the courtesy pass', hint: 'Seats across from each other may swap up to 3 tiles at the end.', initial: true },
  { key: 'botsPlaySecond', label: 'Bots always play the second Charleston', hint: 'For practice: bots vote to go on, so the table plays all six passes unless a person stops.', initial: false },
  { key: 'huddleEveryPass', label: 'Hold every pass', hint: 'Each pass waits for the host to let it go, to talk it over first.', initial: false },
  { key: 'teaching', label: 'Teaching table', hint: 'The host sees every rack all the time.', initial: false },
  { key: 'hideAdvice', label: 'Hide the advice', hint: 'Players see their rack summary but no advised passes: a test of skill.', initial: false },
];

/** Opens a new table with every option the host can choose, and shows each field's error beside it. */
export function CreateTableForm() {
  const navigate = useNavigate();
  const me = useMe();
  // Teaching mode shows the host every rack: only teachers (and admins) may open such a table.
  const mayTeach = me.data?.role === 'teacher' || me.data?.role === 'admin';
  const switches_ = SWITCHES.filter((s) => s.key !== 'teaching' || mayTeach);
  const create = useCreateTable();
  const [name, setName] = useState('');
  const [seed, setSeed] = useState('');
  const [isPrivate, setPrivate] = useState(false);
  const [switches, setSwitches] = useState<Record<Switch, boolean>>(() => Object.fromEntries(SWITCHES.map((s) => [s.key, s.initial])) as Record<Switch, boolean>);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState('');

  const onSubmit = async (e: FormEvent) => {
    e.preventDefault();
    const { teaching, ...rest } = switches;
    const input = { name, private: isPrivate, options: { ...rest, ...(mayTeach ? { teaching } : {}), ...(seed.trim() ? { seed } : {}) } };
    const found = await createTableErrors(input);
    setErrors(found);
    setProblem('');
    if (Object.keys(found).length) return;
    create.mutate(input, {
      onSuccess: (table) => navigate(`/tables/${table.id}${table.inviteCode ? `?invite=${table.inviteCode}` : ''}`),
      onError: (err) => {
        if (err instanceof ApiError) {
          setErrors(err.fields);
          setProblem(err.message);
        } else setProblem('The table could not be opened. Please try again.');
      },
    });
  };

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4" aria-labelledby="create-title">
      <h2 id="create-title" className="text-lead font-semibold">
        Open a new table
      </h2>
      {problem && <FormMessage error>{problem}</FormMessage>}
      <TextField label="Table name" value={name} onChange={(e) => setName(e.target.value)} error={errors.name} required />
      <TextField
        label="Deal seed (optional)"
        hint="A seed names this table's deals, so you can find them again to compare. Other tables on the same seed deal other racks: to put several tables on one deal, use a drill or a lesson. Leave empty for a fresh deal."
        value={seed}
        onChange={(e) => setSeed(e.target.value)}
        error={errors['options.seed'] ?? errors.seed}
      />
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 font-semibold">How the table plays</legend>
        <CheckField label="Private table" hint="Only people with the invite link can find and join it." checked={isPrivate} onChange={setPrivate} error={errors.private} />
        {switches_.map((s) => (
          <CheckField
            key={s.key}
            label={s.label}
            hint={s.hint}
            checked={switches[s.key]}
            onChange={(v) => setSwitches((all) => ({ ...all, [s.key]: v }))}
            error={errors[`options.${s.key}`]}
          />
        ))}
      </fieldset>
      <div>
        <Button kind="primary" type="submit" disabled={create.isPending}>
          {create.isPending ? 'Opening…' : 'Open the table'}
        </Button>
      </div>
    </form>
  );
}

