import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { CURRENCIES, type Currency } from '../../../../shared/lessons';
import { ApiError } from '../../../lib/api/client';
import { useDrills } from '../../../lib/api/drill-list';
import { useScheduleLesson } from '../api/lessons';
import { Button } from '../../../components/ui/Button';
import { FormMessage } from '../../../components/ui/FormMessage';
import { myTimeZone, timeZones, zoneLabel } from '../lesson-time';
import { SelectField } from '../../../components/ui/SelectField';
import { TextField } from '../../../components/ui/TextField';

/** "15", "15.5", "15.50" → 1550; anything else → null. */
export function priceToCents(text: string): number | null {
  const match = text.trim().match(/^(\d{1,5})(?:[.,](\d{1,2}))?$/);
  if (!match) return null;
  return Number(match[1]) * 100 + Number((match[2] ?? '').padEnd(2, '0'));
}

const wholeOrNaN = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));

/** The teacher's form for a new lesson; each server error is shown beside its field. */
export function ScheduleLessonForm() {
  const navigate = useNavigate();
  const schedule = useScheduleLesson();
  const drills = useDrills();
  const [title, setTitle] = useState('');
  const [startsAtLocal, setStartsAtLocal] = useState('');
  const [timeZone, setTimeZone] = useState(myTimeZone);
  const [duration, setDuration] = useState('60');
  const [seats, setSeats] = useState('8');
  const [free, setFree] = useState(true);
  const [price, setPrice] = useState('');
  const [currency, setCurrency] = useState<Currency>('usd');
  const [drillId, setDrillId] = useState('');
  const [seed, setSeed] = useState('');
  const [description, setDescription] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState('');

  function submit(event: FormEvent) {
    event.preventDefault();
    const cents = free ? 0 : priceToCents(price);
    if (cents === null) {
      setErrors({ priceCents: 'Write the price as a number, such as 15 or 12.50.' });
      setProblem('Some fields need another look.');
      return;
    }
    setProblem('');
    schedule.mutate(
      {
        title,
        description,
        startsAtLocal,
        timeZone,
        durationMinutes: wholeOrNaN(duration),
        seats: wholeOrNaN(seats),
        priceCents: cents,
        currency,
        drillIds: drillId ? [drillId] : [],
        ...(seed.trim() ? { seed } : {}),
      },
      {
        onSuccess: (lesson) => navigate(`/lessons/${lesson.id}`),
        onError: (err) => {
          setErrors(err instanceof ApiError ? err.fields : {});
          setProblem(err instanceof ApiError ? err.message : 'The lesson could not be saved. Please try again.');
        },
      },
    );
  }

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-4" aria-labelledby="schedule-title">
      <h2 id="schedule-title" className="text-lead font-semibold">
        Schedule a lesson
      </h2>
      {problem && <FormMessage error>{problem}</FormMessage>}
      <TextField label="Title" value={title} onChange={(e) => setTitle(e.target.value)} error={errors.title} required />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Starts at" type="datetime-local" value={startsAtLocal} onChange={(e) => setStartsAtLocal(e.target.value)} error={errors.startsAtLocal} required />
        <SelectField label="Time zone" hint="The zone the start time is in." value={timeZone} onChange={(e) => setTimeZone(e.target.value)} error={errors.timeZone}>
          {/* The browser's own zone may be a name the list spells another way: keep it choosable. */}
          {[...(timeZones().includes(timeZone) ? [] : [timeZone]), ...timeZones()].map((zone) => (
            <option key={zone} value={zone}>
              {zoneLabel(zone)}
            </option>
          ))}
        </SelectField>
        <TextField label="Length in minutes" type="number" inputMode="numeric" min={15} max={240} value={duration} onChange={(e) => setDuration(e.target.value)} error={errors.durationMinutes} />
        <TextField label="Seats for students" type="number" inputMode="numeric" min={1} max={32} value={seats} onChange={(e) => setSeats(e.target.value)} error={errors.seats} />
      </div>
      <fieldset className="flex flex-col gap-3 rounded-lg border-2 border-line p-4">
        <legend className="px-1 font-medium">Price of a seat</legend>
        <label className="flex min-h-12 items-center gap-3">
          <input type="radio" name="price" className="size-6" checked={free} onChange={() => setFree(true)} />
          Free
        </label>
        <label className="flex min-h-12 items-center gap-3">
          <input type="radio" name="price" className="size-6" checked={!free} onChange={() => setFree(false)} />
          Priced: students pay when they accept
        </label>
        {!free && (
          <div className="grid gap-4 sm:grid-cols-2">
            <TextField label="Price" inputMode="decimal" hint="For example 15 or 12.50." value={price} onChange={(e) => setPrice(e.target.value)} error={errors.priceCents} />
            <SelectField label="Currency" value={currency} onChange={(e) => setCurrency(e.target.value as Currency)} error={errors.currency}>
              {CURRENCIES.map((c) => (
                <option key={c} value={c}>
                  {c.toUpperCase()}
                </option>
              ))}
            </SelectField>
          </div>
        )}
        {free && errors.priceCents && <p className="font-medium text-danger">{errors.priceCents}</p>}
      </fieldset>
      <SelectField
        label="Drill to play"
        hint="Every table of the lesson plays it. Or leave this empty and name a seed below."
        value={drillId}
        onChange={(e) => setDrillId(e.target.value)}
        error={errors.drillIds}
      >
        <option value="">No drill: deal from a seed</option>
        {(drills.data ?? []).map((d) => (
          <option key={d.id} value={d.id}>
            {d.name}
          </option>
        ))}
      </SelectField>
      <TextField label="Deal seed" hint="Any word or phrase, such as harbor-lane-week-01: every table gets the same racks." value={seed} onChange={(e) => setSeed(e.target.value)} error={errors.seed} />
      <TextField label="Note for students (optional)" value={description} onChange={(e) => setDescription(e.target.value)} error={errors.description} />
      <Button kind="primary" type="submit" disabled={schedule.isPending}>
        {schedule.isPending ? 'Saving…' : 'Schedule the lesson'}
      </Button>
    </form>
  );
}
