import { useState } from 'react';
import { Link } from 'react-router-dom';
import { SEATS } from '../../../../shared/seats';
import type { RoomTableDto } from '../../../../shared/lessons';
import { ApiError } from '../../../lib/api/client';
import { useRoom, useSplitRoom, useStartRoom } from '../api/lessons';
import { Button } from '../../../components/ui/Button';
import { FormMessage } from '../../../components/ui/FormMessage';
import { SelectField } from '../../../components/ui/SelectField';
import { TextField } from '../../../components/ui/TextField';

const STATUS = { lobby: 'Waiting to start', playing: 'Playing', done: 'Finished', closed: 'Closed' } as const;

function TableCard({ table }: { table: RoomTableDto }) {
  return (
    <li className="rounded-lg border-2 border-line/60 bg-card p-4">
      <h3 className="font-semibold">{table.name}</h3>
      <p>{STATUS[table.status]}</p>
      <ul className="my-2">
        {SEATS.map((seat) => (
          <li key={seat}>
            <span className="capitalize">{seat}</span>: {table.seats[seat]?.displayName ?? 'empty'}
          </li>
        ))}
      </ul>
      <Link to={`/tables/${table.id}`} className="font-semibold">
        Open {table.name}
      </Link>
    </li>
  );
}

/** The room: the teacher splits the students into tables and starts them; a student finds their own table. */
export function LessonRoom({ lessonId, isTeacher }: { lessonId: string; isTeacher: boolean }) {
  const room = useRoom(lessonId, true);
  const split = useSplitRoom(lessonId);
  const start = useStartRoom(lessonId);
  const [tables, setTables] = useState('');
  const [bot, setBot] = useState('advised');
  const splitError = split.error instanceof ApiError ? split.error : null;
  const startError = start.error instanceof ApiError ? start.error : null;
  const list = room.data ?? [];

  return (
    <section aria-labelledby="room-title" className="flex flex-col gap-4">
      <h2 id="room-title" className="text-lead font-semibold">
        Lesson room
      </h2>
      {room.error && <FormMessage error>{room.error.message}</FormMessage>}
      {isTeacher && list.length === 0 && (
        <form
          noValidate
          className="flex flex-col gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            split.mutate({ bot, ...(tables.trim() ? { tables: Number(tables) } : {}) });
          }}
        >
          <p>Split the students who hold a seat into tables of four. Bots fill the empty seats, and every table gets the same deal.</p>
          {splitError && !Object.keys(splitError.fields).length && <FormMessage error>{splitError.message}</FormMessage>}
          <div className="grid gap-4 sm:grid-cols-2">
            <TextField label="Tables (optional)" hint="Leave empty for as few as hold everyone." inputMode="numeric" value={tables} onChange={(e) => setTables(e.target.value)} error={splitError?.fields.tables} />
            <SelectField label="Bots in empty seats" value={bot} onChange={(e) => setBot(e.target.value)} error={splitError?.fields.bot}>
              <option value="advised">Coach (plays the advice)</option>
              <option value="multiples">Pair keeper</option>
              <option value="random">Wild card</option>
            </SelectField>
          </div>
          <Button kind="primary" type="submit" disabled={split.isPending} className="self-start">
            Split into tables
          </Button>
        </form>
      )}
      {list.length > 0 && (
        <>
          <ul className="grid gap-3 sm:grid-cols-2">
            {list.map((t) => (
              <TableCard key={t.id} table={t} />
            ))}
          </ul>
          {isTeacher && list.some((t) => t.status === 'lobby') && (
            <div className="flex flex-col gap-2">
              {startError && <FormMessage error>{startError.message}</FormMessage>}
              <Button kind="primary" onClick={() => start.mutate()} disabled={start.isPending} className="self-start">
                Start every table
              </Button>
              <p className="text-ink-soft">You host each table: open one and hold its pass to talk it over.</p>
            </div>
          )}
        </>
      )}
      {!isTeacher && list.length === 0 && !room.isPending && <p>Your table appears here once the teacher splits the room.</p>}
    </section>
  );
}
