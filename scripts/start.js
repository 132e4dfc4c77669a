// Starts the built app (build/) with sensible local defaults.
// adapter-node needs ORIGIN to accept form posts; default it to this machine's address.
const port = process.env.PORT ?? '3000';
process.env.PORT = port;
process.env.ORIGIN ??= `http://localhost:${port}`;
process.env.HOST ??= '127.0.0.1';
console.log(`Termwright on ${process.env.ORIGIN} (database: ${process.env.DATABASE_PATH ?? 'data/termwright.db'})`);
await import('../build/index.js');
