// Whether a markdown text parses within a time budget, decided in a worker that is stopped when the
// budget runs out. Answers are kept per text, so a page that renders again does not parse again.

const answers = new Map<string, Promise<boolean>>();

function checkInWorker(text: string, budgetMs: number): Promise<boolean> {
  return new Promise((resolve) => {
    const worker = new Worker(new URL('./markdown-check.worker.ts', import.meta.url), { type: 'module', name: 'markdown-check' });
    const done = (ok: boolean) => {
      clearTimeout(timer);
      worker.terminate();
      resolve(ok);
    };
    const timer = setTimeout(() => done(false), budgetMs);
    worker.onmessage = () => done(true);
    worker.onerror = () => done(false);
    worker.postMessage({ text });
  });
}

export function parsesWithin(text: string, budgetMs: number): Promise<boolean> {
  // without workers (tests in jsdom, very old browsers) there is nothing to measure with
  if (typeof Worker === 'undefined') return Promise.resolve(true);
  let answer = answers.get(text);
  if (!answer) {
    if (answers.size > 50) answers.delete(answers.keys().next().value!);
    answer = checkInWorker(text, budgetMs);
    answers.set(text, answer);
  }
  return answer;
}
