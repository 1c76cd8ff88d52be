// The messages area (top right): problems in role="alert" elements, good news in role="status" ones.
// Alerts stay until dismissed; good news fades out by itself after a few seconds.
import { useEffect } from "react";
import { selectMessages, useAxband, type Message } from "../store";

/** How long good news stays on screen, in ms. */
const STATUS_MS = 8000;

function MessageItem({ message }: { message: Message }) {
  const dismiss = useAxband((s) => s.dismissMessage);
  useEffect(() => {
    if (message.kind !== "status") return;
    const t = setTimeout(() => dismiss(message.id), STATUS_MS);
    return () => clearTimeout(t);
  }, [message, dismiss]);
  return (
    <div role={message.kind} className={`message message-${message.kind}`} data-message-id={message.id}>
      <span className="message-text">{message.text}</span>
      <button
        type="button"
        className="message-dismiss"
        aria-label="Dismiss message"
        onClick={() => dismiss(message.id)}
      >
        ×
      </button>
    </div>
  );
}

export function Messages() {
  const messages = useAxband(selectMessages);
  return (
    <section className="messages" aria-label="Messages">
      {messages.map((m) => (
        <MessageItem key={m.id} message={m} />
      ))}
    </section>
  );
}
