/**
 * The floor for `npm run bench:load`: a bare Socket.IO server that speaks just enough of
 * Rackside's table protocol for the same load client to play against it. A room of four joins,
 * sits and starts; the actions a room gets in one turn of the event loop are answered with one
 * state for each of the four, then acked (Rackside sends one state per viewer per stored group); when all four have acted the room moves to the next step of a fixed Charleston
 * script. No rules, no storage, no sign-in: what is left is the transport, JSON and the fan-out.
 *
 * STATE_BYTES pads each state to about the size of the states Rackside sent in the same run, so
 * the two carry the same bytes. On SIGUSR2 (sent by the bench when it reads memory) it also prints
 * how many states it has sent, the messages its CPU time is divided by.
 */
import { createServer } from 'node:http';
import { Server, type Socket } from 'socket.io';

const SEATS = ['east', 'south', 'west', 'north'] as const;
type Seat = (typeof SEATS)[number];
/** The steps the load client plays through: it votes for a second Charleston and asks for one courtesy tile. */
const SCRIPT: { phase: string; passSize: number }[] = [
  { phase: 'first-right', passSize: 3 },
  { phase: 'first-across', passSize: 3 },
  { phase: 'first-left', passSize: 3 },
  { phase: 'vote', passSize: 0 },
  { phase: 'second-left', passSize: 3 },
  { phase: 'second-across', passSize: 3 },
  { phase: 'second-right', passSize: 3 },
  { phase: 'courtesy-ask', passSize: 0 },
  { phase: 'courtesy-pass', passSize: 1 },
];
const STATE_BYTES = Number(process.env.STATE_BYTES ?? 0);

interface Room {
  id: string;
  sockets: Partial<Record<Seat, Socket>>;
  step: number;
  history: { phase: string }[];
  committed: Record<Seat, boolean>;
  version: number;
  /** Acks waiting for this turn's states to go out; set while a flush is due. */
  pending: ((a: object) => void)[] | null;
}

const rooms = new Map<string, Room>();
/** States sent to clients since the relay started: every one of them is sent while tables play. */
let relayed = 0;
process.on('SIGUSR2', () => process.stdout.write(`relayed ${relayed}\n`));
const rackOf = (seat: Seat) => Array.from({ length: seat === 'east' ? 14 : 13 }, (_, i) => ({ id: `${seat}-${i}`, kind: `bam${(i % 9) + 1}` }));

function stateFor(room: Room, seat: Seat) {
  const at = SCRIPT[room.step];
  const phase = at ? at.phase : 'done';
  const state = {
    tableId: room.id,
    version: room.version,
    phase,
    isHost: seat === 'east',
    mySeat: seat,
    myRack: rackOf(seat),
    huddle: { open: false },
    view: {
      phase,
      passSize: at?.passSize ?? 0,
      history: room.history,
      seats: Object.fromEntries(SEATS.map((s) => [s, { committed: room.committed[s] }])),
    },
    pad: '',
  };
  const size = JSON.stringify(state).length;
  if (size < STATE_BYTES) state.pad = 'x'.repeat(STATE_BYTES - size);
  return state;
}

function broadcast(room: Room) {
  room.version++;
  for (const seat of SEATS) {
    const socket = room.sockets[seat];
    if (!socket) continue;
    socket.emit('table:state', stateFor(room, seat));
    relayed++;
  }
}

/** As Rackside does: whatever a room got in one turn of the event loop goes out as one state per seat, then the acks. */
function answerThisTurn(room: Room, ack: (a: object) => void) {
  if (room.pending) {
    room.pending.push(ack);
    return;
  }
  room.pending = [ack];
  setImmediate(() => {
    const acks = room.pending!;
    room.pending = null;
    broadcast(room);
    for (const a of acks) a({ ok: true });
  });
}

const http = createServer();
const io = new Server(http, { serveClient: false });
io.on('connection', (socket) => {
  let room: Room | undefined;
  let seat: Seat | undefined;
  socket.on('table:join', ({ tableId }: { tableId: string }, ack: (a: object) => void) => {
    room = rooms.get(tableId) ?? { id: tableId, sockets: {}, step: -1, history: [], committed: { east: false, south: false, west: false, north: false }, version: 0, pending: null };
    rooms.set(tableId, room);
    ack({ ok: true });
  });
  socket.on('table:sit', ({ seat: wanted }: { seat: Seat }, ack: (a: object) => void) => {
    if (!room) return ack({ ok: false, code: 'NOT_JOINED' });
    seat = wanted;
    room.sockets[seat] = socket;
    ack({ ok: true });
  });
  socket.on('table:start', (_payload: unknown, ack: (a: object) => void) => {
    if (!room) return ack({ ok: false, code: 'NOT_JOINED' });
    room.step = 0;
    ack({ ok: true });
    broadcast(room);
  });
  socket.on('exchange:act', (_payload: unknown, ack: (a: object) => void) => {
    if (!room || !seat || room.step < 0 || room.step >= SCRIPT.length) return ack({ ok: false, code: 'WRONG_PHASE' });
    if (room.committed[seat]) return ack({ ok: false, code: 'ALREADY_COMMITTED' });
    room.committed[seat] = true;
    if (SEATS.every((s) => room!.committed[s])) {
      if (SCRIPT[room.step].passSize > 0) room.history = [...room.history, { phase: SCRIPT[room.step].phase }];
      room.step++;
      for (const s of SEATS) room.committed[s] = false;
    }
    answerThisTurn(room, ack);
  });
});
http.listen(Number(process.env.PORT ?? 0), () => {
  const address = http.address();
  console.log(`bare relay ready on ${typeof address === 'object' && address ? address.port : ''}`);
});
