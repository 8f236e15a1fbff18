// Starts one of ./servers/*.ts in a child process (its own event loop and CPU, like a deployed server)
// and waits for the port it sends over IPC.
import { fork } from 'node:child_process';

export interface ChildServer {
  url: string;
  stop(): Promise<void>;
}

export function startChildServer(file: string, env: Record<string, string> = {}): Promise<ChildServer> {
  const child = fork(new URL(`../servers/${file}`, import.meta.url).pathname, [], {
    execArgv: ['--import', 'tsx'],
    env: { ...process.env, ...env },
    // Request logs go nowhere, as cheaply as to a log file.
    stdio: ['ignore', 'ignore', 'inherit', 'ipc'],
  });
  return new Promise((resolve, reject) => {
    child.once('error', reject);
    child.once('exit', (code) => reject(new Error(`${file} exited with ${code} before listening`)));
    child.once('message', (m: { port: number }) =>
      resolve({
        url: `http://127.0.0.1:${m.port}`,
        stop: () =>
          new Promise<void>((done) => {
            child.removeAllListeners('exit');
            child.once('exit', () => done());
            child.kill('SIGTERM');
          }),
      }),
    );
  });
}
