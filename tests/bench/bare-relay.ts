/** The floor: a bare Socket.IO server that relays one message to the four sockets of a room. */
import { createServer } from 'node:http';
import { Server } from 'socket.io';

const http = createServer();
const io = new Server(http, { serveClient: false });
io.on('connection', (socket) => {
  socket.on('join', (room: string, ack: () => void) => {
    socket.join(room);
    ack();
  });
  socket.on('relay', (room: string, payload: unknown) => {
    io.to(room).emit('relayed', payload);
  });
});
http.listen(Number(process.env.PORT ?? 0), () => {
  const address = http.address();
  console.log(`bare relay ready on ${typeof address === 'object' && address ? address.port : ''}`);
});
