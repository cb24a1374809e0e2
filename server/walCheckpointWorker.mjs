// The SQLite checkpointer's thread (server/walCheckpointer.ts): its own connection copies committed pages from
// the WAL into the database file, in turns, without waiting for or blocking the server's connection.
import { parentPort, workerData } from 'node:worker_threads';
import Database from 'better-sqlite3';

const db = new Database(workerData.file);
db.pragma('busy_timeout = 5000');
const timer = setInterval(() => {
  try {
    db.pragma('wal_checkpoint(PASSIVE)');
  } catch (e) {
    // A busy database is checkpointed on the next turn; anything else is reported and the turns go on.
    parentPort.postMessage({ error: String(e) });
  }
}, workerData.everyMs);
parentPort.on('message', (message) => {
  if (message !== 'close') return;
  clearInterval(timer);
  db.close();
  parentPort.close();
});
