/**
 * @mentions in a comment: find the "@name" being typed at the caret, suggest team members, and
 * insert the chosen full name. A mention is written as "@" followed by the member's name.
 */

export interface MentionCandidate {
  userId: string;
  name: string;
  email: string;
}

export interface ActiveMention {
  /** Index of the "@". */
  start: number;
  /** Text typed after the "@" up to the caret. */
  query: string;
}

const MAX_QUERY = 40;

/**
 * The mention being typed at `caret`, or null. The "@" must open the text or follow white space
 * or an opening bracket (so an e-mail address never triggers it), and the query stays on one line.
 */
export function activeMention(text: string, caret: number): ActiveMention | null {
  const end = Math.max(0, Math.min(caret, text.length));
  for (let i = end - 1; i >= 0 && end - i <= MAX_QUERY + 1; i--) {
    const ch = text[i];
    if (ch === "\n") return null;
    if (ch === "@") {
      const before = i === 0 ? " " : text[i - 1];
      if (!/[\s([{]/.test(before)) return null;
      return { start: i, query: text.slice(i + 1, end) };
    }
  }
  return null;
}

const fold = (s: string) => s.normalize("NFD").replace(/\p{M}/gu, "").toLowerCase();

/**
 * Members whose name (or any word of it, or their e-mail) starts with the query, best first:
 * full-name prefix before word prefix before e-mail, then by name. An empty query lists everyone.
 */
export function matchMembers<T extends MentionCandidate>(
  members: readonly T[],
  query: string,
  limit = 6,
): T[] {
  const q = fold(query);
  const scored: Array<{ member: T; score: number }> = [];
  for (const member of members) {
    const name = fold(member.name);
    let score = -1;
    if (name.startsWith(q)) score = 0;
    else if (name.split(/[\s-]+/).some((word) => word.startsWith(q))) score = 1;
    else if (fold(member.email).startsWith(q)) score = 2;
    if (score >= 0) scored.push({ member, score });
  }
  scored.sort((a, b) => a.score - b.score || a.member.name.localeCompare(b.member.name));
  return scored.slice(0, limit).map((s) => s.member);
}

/** Replaces the typed "@query" by "@Full Name " and returns the new text and caret. */
export function insertMention(
  text: string,
  mention: ActiveMention,
  caret: number,
  name: string,
): { text: string; caret: number } {
  const inserted = `@${name} `;
  const after = text.slice(caret).replace(/^ /, "");
  const next = text.slice(0, mention.start) + inserted + after;
  return { text: next, caret: mention.start + inserted.length };
}

/**
 * Splits a comment body into text and mentions of known members (longest name first, so
 * "@Ann Lee" wins over "@Ann"), for highlighting.
 */
export function splitMentions(
  body: string,
  names: readonly string[],
): Array<{ kind: "text" | "mention"; value: string }> {
  const sorted = [...new Set(names)].filter(Boolean).sort((a, b) => b.length - a.length);
  const parts: Array<{ kind: "text" | "mention"; value: string }> = [];
  let textStart = 0;
  let i = 0;
  while (i < body.length) {
    const boundary = i === 0 || /[\s([{]/.test(body[i - 1]);
    if (body[i] === "@" && boundary) {
      const rest = body.slice(i + 1);
      const name = sorted.find(
        (n) =>
          rest.toLowerCase().startsWith(n.toLowerCase()) &&
          !/[\p{L}\p{N}]/u.test(rest.charAt(n.length)),
      );
      if (name) {
        if (i > textStart) parts.push({ kind: "text", value: body.slice(textStart, i) });
        parts.push({ kind: "mention", value: body.slice(i, i + 1 + name.length) });
        i += 1 + name.length;
        textStart = i;
        continue;
      }
    }
    i++;
  }
  if (textStart < body.length) parts.push({ kind: "text", value: body.slice(textStart) });
  return parts;
}
