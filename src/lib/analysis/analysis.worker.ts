/// <reference lib="webworker" />
/** Works out a rack's focus, odds and advice off the page's thread, so the page never stalls. */
import { answer, type AnalysisRequest } from './requests';

self.onmessage = (event: MessageEvent<{ id: number; request: AnalysisRequest }>) => {
  const { id, request } = event.data;
  try {
    self.postMessage({ id, answer: answer(request) });
  } catch (err) {
    self.postMessage({ id, error: err instanceof Error ? err.message : String(err) });
  }
};
