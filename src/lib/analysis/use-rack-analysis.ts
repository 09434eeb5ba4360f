import { useEffect, useState } from 'react';
import { answer, type AnalysisAnswer, type AnalysisRequest } from './requests';

type Waiter = (result: { answer?: AnalysisAnswer; error?: string }) => void;

let worker: Worker | null | undefined;
let nextId = 1;
const waiting = new Map<number, Waiter>();

/** One worker for the page, made on first use; none where workers are not available (the page then works it out itself). */
function analysisWorker(): Worker | null {
  if (worker !== undefined) return worker;
  if (typeof Worker === 'undefined') return (worker = null);
  try {
    worker = new Worker(new URL('./analysis.worker.ts', import.meta.url), { type: 'module' });
    worker.onmessage = (event: MessageEvent<{ id: number; answer?: AnalysisAnswer; error?: string }>) => {
      const done = waiting.get(event.data.id);
      waiting.delete(event.data.id);
      done?.(event.data);
    };
  } catch {
    worker = null;
  }
  return worker;
}

function ask(request: AnalysisRequest): Promise<AnalysisAnswer> {
  const w = analysisWorker();
  if (!w) {
    // No worker: after this turn, so the page paints first.
    return new Promise((resolve, reject) => setTimeout(() => {
      try {
        resolve(answer(request));
      } catch (err) {
        reject(err);
      }
    }, 0));
  }
  const id = nextId++;
  return new Promise((resolve, reject) => {
    waiting.set(id, (result) => (result.answer ? resolve(result.answer) : reject(new Error(result.error ?? 'The analysis failed.'))));
    w.postMessage({ id, request });
  });
}

/**
 * The analysis of a rack, worked out off the page's thread; `key` names the request (the same key,
 * the same answer), and the last answer stays on screen while a new one is worked out.
 */
export function useRackAnalysis(request: AnalysisRequest | null, key: string) {
  const [state, setState] = useState<{ key: string; answer: AnalysisAnswer | null; error: string | null }>({ key: '', answer: null, error: null });
  useEffect(() => {
    if (!request) return;
    let live = true;
    ask(request).then(
      (a) => live && setState({ key, answer: a, error: null }),
      (err: Error) => live && setState((s) => ({ key, answer: s.answer, error: err.message })),
    );
    return () => {
      live = false;
    };
    // The key stands for the request.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);
  return { answer: state.answer, fresh: state.key === key, error: state.error };
}
