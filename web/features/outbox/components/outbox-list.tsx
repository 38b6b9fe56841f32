import { formatDateTimeUtc } from '../../../lib/format';
import type { OutboxMessage } from '../api/get-outbox';

/**
 * Captured messages, newest first (the API's order, kept). Bodies are shown as plain text inside
 * <pre>: React escapes it, and the HTML part is deliberately never injected.
 */
export function OutboxList({ messages }: { messages: OutboxMessage[] }) {
  return (
    <ul className="flex flex-col gap-3" aria-label="Captured e-mails">
      {messages.map((m) => (
        <li key={m.id} className="rounded-xl border border-night-700 bg-night-900/80">
          <details className="group">
            <summary className="flex cursor-pointer list-none flex-wrap items-baseline gap-x-4 gap-y-1 rounded-xl px-5 py-3 hover:bg-night-800/50">
              <span aria-hidden="true" className="text-ember-400 transition-transform group-open:rotate-90">›</span>
              <span className="font-medium text-night-100">{m.subject}</span>
              <span className="font-mono text-xs text-night-300">to {m.to}</span>
              <time dateTime={m.receivedAt} className="ml-auto text-xs text-night-400">
                {formatDateTimeUtc(m.receivedAt)}
              </time>
            </summary>
            <pre className="overflow-x-auto border-t border-night-700 px-5 py-4 font-mono text-xs whitespace-pre-wrap break-words text-night-200">
              {m.text}
            </pre>
          </details>
        </li>
      ))}
    </ul>
  );
}
