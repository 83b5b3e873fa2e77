import {
  useId,
  useLayoutEffect,
  useRef,
  useState,
  type KeyboardEvent,
  type TextareaHTMLAttributes,
} from "react";
import { activeMention, insertMention, matchMembers, type MentionCandidate } from "../lib/mentions";

type Props = Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, "value" | "onChange"> & {
  value: string;
  onChange: (value: string) => void;
  members: readonly MentionCandidate[];
};

/**
 * A textarea that suggests team members while "@name" is typed (a combobox: arrow keys move,
 * Enter or Tab picks, Escape closes) and writes the chosen member as "@Full Name".
 */
export function MentionTextarea({ value, onChange, members, onKeyDown, onBlur, ...rest }: Props) {
  const listId = useId();
  const ref = useRef<HTMLTextAreaElement>(null);
  const [caret, setCaret] = useState(0);
  const [highlight, setHighlight] = useState(0);
  const [dismissedAt, setDismissedAt] = useState<number | null>(null);
  const pendingCaret = useRef<number | null>(null);

  const mention = activeMention(value, caret);
  const options = mention ? matchMembers(members, mention.query) : [];
  const open = mention !== null && options.length > 0 && dismissedAt !== mention.start;
  const active = open ? Math.min(highlight, options.length - 1) : -1;

  useLayoutEffect(() => {
    if (pendingCaret.current === null || !ref.current) return;
    ref.current.setSelectionRange(pendingCaret.current, pendingCaret.current);
    setCaret(pendingCaret.current);
    pendingCaret.current = null;
  }, [value]);

  const pick = (member: MentionCandidate) => {
    if (!mention) return;
    const next = insertMention(value, mention, caret, member.name);
    pendingCaret.current = next.caret;
    onChange(next.text);
    setHighlight(0);
    ref.current?.focus();
  };

  const syncCaret = () => setCaret(ref.current?.selectionStart ?? 0);

  const handleKeyDown = (event: KeyboardEvent<HTMLTextAreaElement>) => {
    if (open) {
      if (event.key === "ArrowDown" || event.key === "ArrowUp") {
        event.preventDefault();
        const step = event.key === "ArrowDown" ? 1 : -1;
        setHighlight((active + step + options.length) % options.length);
        return;
      }
      if (event.key === "Enter" || event.key === "Tab") {
        event.preventDefault();
        pick(options[active]);
        return;
      }
      if (event.key === "Escape") {
        event.preventDefault();
        setDismissedAt(mention.start);
        return;
      }
    }
    onKeyDown?.(event);
  };

  return (
    <div className="relative">
      <textarea
        {...rest}
        ref={ref}
        value={value}
        role="combobox"
        aria-autocomplete="list"
        aria-expanded={open}
        aria-controls={open ? listId : undefined}
        aria-activedescendant={open ? `${listId}-${active}` : undefined}
        onChange={(event) => {
          onChange(event.target.value);
          setCaret(event.target.selectionStart ?? event.target.value.length);
          setHighlight(0);
        }}
        onKeyDown={handleKeyDown}
        onKeyUp={syncCaret}
        onClick={syncCaret}
        onSelect={syncCaret}
        onBlur={onBlur}
      />
      {open ? (
        <ul
          id={listId}
          role="listbox"
          aria-label="Mention a team member"
          className="absolute left-0 z-20 mt-1 max-h-56 w-72 overflow-auto rounded-md border border-rule bg-card py-1 shadow-lg"
        >
          {options.map((member, i) => (
            <li
              key={member.userId}
              id={`${listId}-${i}`}
              role="option"
              aria-selected={i === active}
              // Keep focus in the textarea: pick on mouse down, before the blur.
              onMouseDown={(event) => {
                event.preventDefault();
                pick(member);
              }}
              onMouseEnter={() => setHighlight(i)}
              className={`cursor-pointer px-3 py-1.5 text-sm ${i === active ? "bg-ink text-card" : "text-ink-deep hover:bg-paper-deep"}`}
            >
              <span className="font-medium">{member.name}</span>
              <span
                className={`ml-2 font-mono text-xs ${i === active ? "text-card/80" : "text-ink-soft"}`}
              >
                {member.email}
              </span>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
