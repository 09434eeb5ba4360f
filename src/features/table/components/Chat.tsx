import { useRef, useState } from 'react';
import type { ChatMessageDto } from '../../../../shared/protocol';
import { TABLE_LIMITS } from '../../../../shared/protocol';
import { Button } from '../../../components/ui/Button';

/** The table's conversation: a log that reads new messages aloud politely, and a box to add one. */
export function Chat({ messages, onSend }: { messages: readonly ChatMessageDto[]; onSend: (text: string) => Promise<boolean> }) {
  const [text, setText] = useState('');
  // One message at a time: Send is disabled until the table answers, and a second click before that re-render sends nothing.
  const [sending, setSending] = useState(false);
  const busy = useRef(false);

  async function send() {
    if (!text.trim() || busy.current) return;
    busy.current = true;
    setSending(true);
    try {
      if (await onSend(text)) setText('');
    } finally {
      busy.current = false;
      setSending(false);
    }
  }
  return (
    <section aria-labelledby="chat-title" className="flex flex-col gap-2 rounded-card border border-line/60 bg-card p-4">
      <h2 id="chat-title" className="text-lead font-semibold">
        Table talk
      </h2>
      {/* The log wraps the list (a role on the list itself would unmake it) and takes focus so the keyboard can scroll it. */}
      <div role="log" aria-live="polite" aria-label="Messages" tabIndex={0} className="max-h-72 overflow-y-auto rounded-md">
        <ol className="flex flex-col gap-1">
          {messages.length === 0 && <li className="text-ink-soft">No messages yet.</li>}
          {messages.map((m) => (
            <li key={m.id} className="min-w-0 break-words [overflow-wrap:anywhere]">
              <span className="font-semibold">{m.displayName}</span>
              {m.seat && <span className="text-sm text-ink-soft"> ({m.seat})</span>}: {m.text}
            </li>
          ))}
        </ol>
      </div>
      <form
        className="flex flex-wrap gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          void send();
        }}
      >
        <label htmlFor="chat-text" className="sr-only">
          Message to the table
        </label>
        <input
          id="chat-text"
          value={text}
          maxLength={TABLE_LIMITS.chatMax}
          onChange={(e) => setText(e.target.value)}
          placeholder="Say something to the table"
          className="min-h-12 min-w-0 flex-1 rounded-lg border-2 border-line bg-card px-3"
        />
        <Button type="submit" disabled={!text.trim() || sending}>
          Send
        </Button>
      </form>
    </section>
  );
}
