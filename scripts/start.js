// Starts the built app (build/) with sensible local defaults.
// adapter-node needs ORIGIN to accept form posts; default it to this machine's address.
import { answerClientErrorsAsJson } from './client-error.js';

const port = process.env.PORT ?? '3000';
// Project backups are uploaded as one file; adapter-node refuses bodies over 512 kB unless told.
process.env.BODY_SIZE_LIMIT ??= '17M';
process.env.PORT = port;
process.env.ORIGIN ??= `http://localhost:${port}`;
process.env.HOST ??= '127.0.0.1';
console.log(`Termwright on ${process.env.ORIGIN} (database: ${process.env.DATABASE_PATH ?? 'data/termwright.db'})`);
const { server } = await import('../build/index.js');
// polka keeps the node:http server on `.server`.
answerClientErrorsAsJson(server.server);
