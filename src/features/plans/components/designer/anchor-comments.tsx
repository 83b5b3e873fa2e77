import {
  createContext,
  useCallback,
  useContext,
  useEffect,
  useId,
  useLayoutEffect,
  useMemo,
  useRef,
  useState,
  type KeyboardEvent,
  type ReactNode,
  type RefObject,
} from "react";
import { createPortal } from "react-dom";
import type { CommentAnchor } from "@/contracts/plans";
import { useDesignerSlots, type AnchorThreadCount, type DesignerSlots } from "../../designer-slots";

interface Scope {
  planId: string;
  /** The chip whose comments are open; one at a time in the whole designer. */
  openId: string | null;
  setOpenId: (id: string | null) => void;
}

const ScopeContext = createContext<Scope | null>(null);

/** Names the plan the comment chips below belong to, and keeps one chip open at a time. */
export function AnchorCommentsScope({ planId, children }: { planId: string; children: ReactNode }) {
  const [openId, setOpenId] = useState<string | null>(null);
  const scope = useMemo(() => ({ planId, openId, setOpenId }), [planId, openId]);
  return <ScopeContext value={scope}>{children}</ScopeContext>;
}

/**
 * A small chip beside a layer, refractor or shot row: a speech mark with the number of open
 * threads anchored there (ochre while any are open). It opens a panel with those threads, the
 * replies and a form for a new comment anchored there. Renders nothing unless the app lent
 * the designer its comment threads (DesignerSlotsProvider) inside an AnchorCommentsScope.
 *
 * `label` names the place in running text: "layer 2", "shot 1". `compact` suits a line of
 * text; `align` says which edge of the chip the panel lines up with ("end": it opens leftwards).
 */
export function AnchorCommentsChip(props: ChipProps) {
  const slots = useDesignerSlots();
  const scope = useContext(ScopeContext);
  if (!slots || !scope) return null;
  return <Chip slots={slots} scope={scope} {...props} />;
}

interface ChipProps {
  anchor: CommentAnchor;
  label: string;
  compact?: boolean;
  align?: "start" | "end";
}

/** "(1 open, 2 resolved)", or "" for a place nobody has commented on yet. */
function countText(count: AnchorThreadCount | null): string {
  if (!count) return "";
  const parts = [
    count.open > 0 ? `${count.open} open` : null,
    count.resolved > 0 ? `${count.resolved} resolved` : null,
  ].filter(Boolean);
  return parts.length > 0 ? ` (${parts.join(", ")})` : "";
}

function Chip({
  slots,
  scope,
  anchor,
  label,
  compact = false,
  align = "end",
}: ChipProps & { slots: DesignerSlots; scope: Scope }) {
  const id = useId();
  const chip = useRef<HTMLSpanElement>(null);
  const countOf = slots.useAnchorCounts(scope.planId);
  const count = countOf ? countOf(anchor) : null;
  const open = scope.openId === id;
  const { setOpenId } = scope;
  const title = `Comments on ${label}`;
  const name = `${title}${countText(count)}`;
  const hot = (count?.open ?? 0) > 0;

  const close = useCallback(
    (returnFocus: boolean) => {
      setOpenId(null);
      if (returnFocus) chip.current?.focus();
    },
    [setOpenId],
  );
  const toggle = () => setOpenId(open ? null : id);
  const onKeyDown = (event: KeyboardEvent<HTMLSpanElement>) => {
    if (event.key === "Enter" || event.key === " ") {
      event.preventDefault();
      toggle();
    }
  };

  return (
    <>
      {/*
        Not a <button>: the plan's inputs sit in a fieldset that is disabled for read-only
        plans, and that would disable a button too, yet reviewers comment on read-only plans.
      */}
      <span
        ref={chip}
        role="button"
        tabIndex={0}
        aria-label={name}
        title={name}
        data-comment-chip=""
        aria-haspopup="dialog"
        aria-expanded={open}
        aria-controls={open ? `${id}-panel` : undefined}
        onClick={toggle}
        onKeyDown={onKeyDown}
        className={`inline-flex ${compact ? "h-6 min-w-6 max-sm:h-8 max-sm:min-w-8" : "h-7 min-w-7 max-sm:h-9 max-sm:min-w-9"} shrink-0 cursor-pointer items-center justify-center gap-1 rounded-md border px-1.5 text-xs select-none ${
          open
            ? "border-ink bg-ink text-card"
            : hot
              ? "border-ochre/70 bg-ochre-soft text-ink-deep hover:border-ochre"
              : "border-rule bg-card text-ink-soft hover:bg-paper-deep hover:text-ink"
        }`}
      >
        <SpeechMark />
        {hot ? (
          <span aria-hidden className="font-mono leading-none font-semibold">
            {count?.open}
          </span>
        ) : null}
      </span>
      {open
        ? createPortal(
            <CommentsPanel
              id={`${id}-panel`}
              title={title}
              chip={chip}
              align={align}
              onClose={close}
            >
              {slots.renderAnchorComments(scope.planId, anchor)}
            </CommentsPanel>,
            document.body,
          )
        : null}
    </>
  );
}

/** An outlined speech mark (our own drawing). */
function SpeechMark() {
  return (
    <svg aria-hidden viewBox="0 0 16 16" className="h-3.5 w-3.5 shrink-0" fill="none">
      <path
        d="M3 2.75h10A1.25 1.25 0 0 1 14.25 4v6A1.25 1.25 0 0 1 13 11.25H7.5L4.5 13.75v-2.5H3A1.25 1.25 0 0 1 1.75 10V4A1.25 1.25 0 0 1 3 2.75Z"
        stroke="currentColor"
        strokeWidth="1.4"
        strokeLinejoin="round"
      />
    </svg>
  );
}

const PANEL_WIDTH = 416; // px, 26rem
const GAP = 6;
const MARGIN = 8;

/**
 * The open comments, floating under their chip. It lives at the end of the page (a portal):
 * inside the plan's form its own form would be nested in the plan's and its fields disabled
 * with the plan's on a read-only plan. Escape or ✕ closes it (focus goes back to the chip);
 * a click elsewhere closes it unless a comment is being written.
 */
function CommentsPanel({
  id,
  title,
  chip,
  align,
  onClose,
  children,
}: {
  id: string;
  title: string;
  chip: RefObject<HTMLSpanElement | null>;
  align: "start" | "end";
  onClose: (returnFocus: boolean) => void;
  children: ReactNode;
}) {
  const panel = useRef<HTMLDivElement>(null);
  const [place, setPlace] = useState<{ top: number; left: number; width: number } | null>(null);

  useLayoutEffect(() => {
    const target = chip.current;
    if (!target) return;
    const measure = () => {
      // The chip's editor or view was hidden (the designer keeps hidden tabs mounted).
      if (!target.isConnected || target.closest("[hidden]")) {
        onClose(false);
        return;
      }
      const rect = target.getBoundingClientRect();
      const viewport = document.documentElement.clientWidth || window.innerWidth;
      const width = Math.max(240, Math.min(PANEL_WIDTH, viewport - 2 * MARGIN));
      const wanted = align === "start" ? rect.left : rect.right - width;
      const left = Math.min(Math.max(MARGIN, wanted), viewport - width - MARGIN);
      setPlace({
        top: rect.bottom + window.scrollY + GAP,
        left: Math.max(MARGIN, left) + window.scrollX,
        width,
      });
    };
    measure();
    window.addEventListener("resize", measure);
    window.addEventListener("scroll", measure, true);
    const observer = typeof ResizeObserver === "undefined" ? null : new ResizeObserver(measure);
    observer?.observe(target);
    observer?.observe(document.body);
    return () => {
      window.removeEventListener("resize", measure);
      window.removeEventListener("scroll", measure, true);
      observer?.disconnect();
    };
  }, [chip, align, onClose]);

  useEffect(() => {
    panel.current?.focus({ preventScroll: true });
    panel.current?.scrollIntoView?.({ block: "nearest" });
  }, []);

  useEffect(() => {
    // On click, not pointerdown: closing shortens the page, and the page must not move under
    // a press on a link before it is released. A chip's own click switches the panel.
    const onClick = (event: MouseEvent) => {
      const target = event.target as Element | null;
      if (!target || panel.current?.contains(target) || target.closest?.("[data-comment-chip]"))
        return;
      const writing = Array.from(panel.current?.querySelectorAll("textarea") ?? []).some(
        (box) => box.value.trim() !== "",
      );
      if (!writing) onClose(false);
    };
    // Escape closes from anywhere, unless something inside used it (a mention list closing).
    const onKeyDown = (event: globalThis.KeyboardEvent) => {
      if (event.key !== "Escape" || event.defaultPrevented) return;
      const focus = document.activeElement;
      const fromPanel = !focus || focus === document.body || !!panel.current?.contains(focus);
      onClose(fromPanel);
    };
    document.addEventListener("click", onClick);
    document.addEventListener("keydown", onKeyDown);
    return () => {
      document.removeEventListener("click", onClick);
      document.removeEventListener("keydown", onKeyDown);
    };
  }, [onClose]);

  return (
    <div
      ref={panel}
      id={id}
      role="dialog"
      aria-label={title}
      tabIndex={-1}
      style={{
        position: "absolute",
        top: place?.top ?? 0,
        left: place?.left ?? 0,
        width: place?.width ?? PANEL_WIDTH,
      }}
      className="z-40 rounded-lg border border-rule bg-card text-left font-sans shadow-lg shadow-ink-deep/15 outline-none"
      // React bubbles events out of a portal to the chip's ancestors: the plan's form must
      // not take a comment's submit for a save.
      onSubmit={(event) => event.stopPropagation()}
    >
      <div className="flex items-center justify-between gap-2 border-b border-rule px-3 py-2">
        <h2 className="text-sm font-semibold text-ink-deep">{title}</h2>
        <button
          type="button"
          aria-label="Close comments"
          title="Close (Esc)"
          onClick={() => onClose(true)}
          className="h-7 w-7 rounded-md text-sm text-ink hover:bg-paper-deep"
        >
          ✕
        </button>
      </div>
      <div className="max-h-[min(34rem,70vh)] overflow-y-auto p-3">{children}</div>
    </div>
  );
}
