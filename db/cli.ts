import { fileURLToPath } from 'node:url';

/**
 * Runs `task(DATABASE_URL)` when the calling module is the script node was started with
 * (`tsx db/migrate.ts`), and stays quiet when it is imported (tests, other scripts).
 */
export function runAsScript(moduleUrl: string, name: string, task: (url: string) => Promise<void>, done: string): void {
  if (!process.argv[1] || fileURLToPath(moduleUrl) !== process.argv[1]) return;
  const url = process.env.DATABASE_URL;
  if (!url) {
    console.error('DATABASE_URL is not set');
    process.exit(1);
  }
  task(url)
    .then(() => console.log(done))
    .catch((err: Error) => {
      console.error(`${name} failed: ${err.message}`);
      process.exit(1);
    });
}
