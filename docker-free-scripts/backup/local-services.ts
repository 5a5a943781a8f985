// A local profile's PostgreSQL and S3 fake for a backup or restore run outside `npm start`: what
// is not running is started for the run and stopped after it (as db-reset.sh does), so
// `npm run restore -- <folder> --profile lane3` works on a profile that was never started.
// Services that are already up (npm start, npm test) are used as they are.
import { execFile, spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync, openSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { promisify } from 'node:util';

const root = path.resolve(import.meta.dirname, '../..');
const run = promisify(execFile);

function answers(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host: '127.0.0.1', port });
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

async function waitForPort(port: number, child: ChildProcess, what: string, logFile: string): Promise<void> {
  // Start-up on a busy machine takes seconds; the child's exit ends the wait at once.
  for (let i = 0; i < 600; i++) {
    if (child.exitCode !== null) throw new Error(`The ${what} exited during start-up (log: ${path.relative(root, logFile)}).`);
    if (await answers(port)) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`The ${what} did not answer on 127.0.0.1:${port} within 60 s.`);
}

export interface LocalServices {
  started: string[];
  stop(): Promise<void>;
}

/** Starts the profile's PostgreSQL and S3 fake when they are not answering (env.sh values in process.env). */
export async function ensureLocalServices(profile: string, log: (line: string) => void): Promise<LocalServices> {
  const env = process.env;
  const started: string[] = [];
  let s3: ChildProcess | null = null;
  let pgStarted = false;
  const stop = async () => {
    if (s3 && s3.exitCode === null) {
      s3.kill('SIGTERM');
      await new Promise((r) => s3!.once('exit', r));
    }
    if (pgStarted) await run('bash', [path.join(root, 'docker-free-scripts/db-stop.sh'), profile, '--quiet']).catch(() => undefined);
  };
  try {
    if (!(await answers(Number(env.PG_PORT)))) {
      log(`Starting the ${profile} PostgreSQL on 127.0.0.1:${env.PG_PORT} for this run …`);
      await run('bash', [path.join(root, 'docker-free-scripts/db-start.sh'), profile], { maxBuffer: 4 * 1024 * 1024 });
      pgStarted = true;
      started.push('PostgreSQL');
    }
    if (!(await answers(Number(env.S3_PORT)))) {
      log(`Starting the ${profile} S3 fake on 127.0.0.1:${env.S3_PORT} for this run …`);
      const logs = env.RIMELINE_LOGS ?? path.join(root, '.data', profile, 'logs');
      mkdirSync(logs, { recursive: true });
      const logFile = path.join(logs, 's3-backup.log');
      const out = openSync(logFile, 'a');
      const dir = path.join(env.RIMELINE_DATA ?? path.join(root, '.data', profile), 's3');
      s3 = spawn(path.join(root, 'node_modules/.bin/tsx'), ['docker-free-scripts/s3-server.ts', '--port', String(env.S3_PORT), '--dir', dir, '--bucket', String(env.S3_BUCKET)], {
        cwd: root,
        env,
        stdio: ['ignore', out, out],
      });
      await waitForPort(Number(env.S3_PORT), s3, 'S3 fake', logFile);
      started.push('S3 fake');
    }
  } catch (error) {
    await stop();
    throw error;
  }
  return { started, stop };
}
