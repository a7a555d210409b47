import { spawn, type ChildProcess } from 'node:child_process';
import http from 'node:http';

export interface Managed {
  name: string;
  child: ChildProcess;
  exited: Promise<number | null>;
}

/** Starts `node --import tsx <entry>` with the shared settings; its output goes to the benchmark's stderr when something fails. */
export function startProcess(name: string, entry: string, env: NodeJS.ProcessEnv): Managed {
  const child = spawn(process.execPath, ['--import', 'tsx', entry], { env: { ...process.env, ...env }, stdio: ['ignore', 'ignore', 'pipe'] });
  let errors = '';
  child.stderr!.on('data', (d: Buffer) => (errors = (errors + d.toString()).slice(-4000)));
  const exited = new Promise<number | null>((resolve) =>
    child.on('exit', (code) => {
      process.stderr.write(`[${name}] exited with ${code}${code === 0 ? '' : `\n${errors}`}\n`);
      resolve(code);
    }),
  );
  return { name, child, exited };
}

/** Resolves when GET url answers 200, polling every 100 ms. */
export async function waitReady(url: string, timeoutMs = 180_000): Promise<number> {
  const started = Date.now();
  while (Date.now() - started < timeoutMs) {
    const ok = await new Promise<boolean>((resolve) => {
      const req = http.get(url, { agent: false, timeout: 1000 }, (res) => {
        res.resume();
        resolve(res.statusCode === 200);
      });
      req.on('error', () => resolve(false));
      req.on('timeout', () => req.destroy());
    });
    if (ok) return Date.now() - started;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`${url} was not ready within ${timeoutMs} ms`);
}

/** SIGTERM and the time until the process exited, with its exit code. */
export async function stopProcess(p: Managed): Promise<{ ms: number; code: number | null }> {
  const started = Date.now();
  p.child.kill('SIGTERM');
  const code = await p.exited;
  return { ms: Date.now() - started, code };
}
