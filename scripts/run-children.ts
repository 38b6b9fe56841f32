/** Runs the long-lived processes of `npm start`/`npm run dev` and stops them all on Ctrl-C. */
import { spawn, type ChildProcess } from 'node:child_process';

export interface ChildSpec { name: string; command: string; args: string[]; env?: Record<string, string> }

export function runChildren(specs: ChildSpec[], onStopped: () => Promise<void>): void {
  const children: ChildProcess[] = [];
  let stopping = false;
  const stopAll = async (code: number) => {
    if (stopping) return;
    stopping = true;
    console.log('\nStopping…');
    await Promise.all(children.map((child) => new Promise<void>((resolve) => {
      if (child.exitCode !== null || child.signalCode !== null) return resolve();
      child.once('exit', () => resolve());
      child.kill('SIGTERM');
      setTimeout(() => child.kill('SIGKILL'), 10_000).unref();
    })));
    await onStopped();
    process.exit(code);
  };
  for (const spec of specs) {
    const child = spawn(spec.command, spec.args, { stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, ...spec.env } });
    const prefix = (line: string) => (line ? `[${spec.name}] ${line}\n` : '');
    child.stdout!.on('data', (b: Buffer) => process.stdout.write(b.toString().split('\n').map(prefix).join('')));
    child.stderr!.on('data', (b: Buffer) => process.stderr.write(b.toString().split('\n').map(prefix).join('')));
    child.on('exit', (code, signal) => {
      if (!stopping) {
        console.error(`[${spec.name}] exited (${signal ?? code}); stopping the rest`);
        void stopAll(code ?? 1);
      }
    });
    children.push(child);
  }
  process.on('SIGINT', () => void stopAll(0));
  process.on('SIGTERM', () => void stopAll(0));
}
