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

/** Another tab saved newer work: autosave is paused until the user picks one of the two. */
function TabConflictItem() {
  const conflict = useAxband((s) => s.ui.tabConflict);
  const choose = useAxband((s) => s.chooseTabConflict);
  if (!conflict) return null;
  return (
    <div role="alert" className="message message-alert" data-testid="tab-conflict">
      <span className="message-text">
        Another tab saved newer work at {new Date(conflict.savedAt).toLocaleTimeString()}. Changes in this tab are not
        saved until you choose.
      </span>
      <button type="button" disabled={conflict.choice !== null} onClick={() => choose("load")}>
        Load it
      </button>
      <button type="button" disabled={conflict.choice !== null} onClick={() => choose("keep")}>
        Keep mine and save
      </button>
    </div>
  );
}

export function Messages() {
  const messages = useAxband(selectMessages);
  return (
    <section className="messages" aria-label="Messages">
      <TabConflictItem />
      {messages.map((m) => (
        <MessageItem key={m.id} message={m} />
      ))}
    </section>
  );
}
