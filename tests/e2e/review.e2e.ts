/**
 * Team review in the browser: a survey lead and a reviewer, each in their own browser profile,
 * run submit → request changes → revise → approve on one plan, and each sees the notices in the
 * inbox; an admin finds the matching e-mails in the demo mailbox.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import {
  DEMO_PASSWORD,
  demoAccounts,
  openBrowser,
  screenshot,
  signIn,
  startApp,
  type E2eApp,
} from "./harness";

type Browser = Awaited<ReturnType<typeof openBrowser>>;

let app: E2eApp;
let lead: Browser;
let reviewer: Browser;
let planId = "";
/** Unread notices each had before this test (the demo data brings a few). */
let leadUnread = 0;
let reviewerUnread = 0;

const SITE = "Scarrowfield road cutting";
const PLAN = "Scarrowfield cutting, line B";
const LEAD_NAME = "Tobias Renshaw";
const REVIEWER_NAME = "Ines Varga-Lind";

beforeAll(async () => {
  app = await startApp();
  [lead, reviewer] = await Promise.all([openBrowser(), openBrowser()]);
  await Promise.all([
    signIn(lead.page, app.url, demoAccounts.lead),
    signIn(reviewer.page, app.url, demoAccounts.reviewer),
  ]);
  [leadUnread, reviewerUnread] = await Promise.all([
    unreadCount(lead.page),
    unreadCount(reviewer.page),
  ]);
});

afterAll(async () => {
  await Promise.all([lead?.close(), reviewer?.close()]);
  await app?.close();
});

const reviewUrl = () => `${app.url}/plans/${planId}/review`;

/** The unread count the header's inbox link shows (0 without a badge). */
async function unreadCount(page: Page): Promise<number> {
  const link = page.getByRole("link", { name: /^Inbox/ });
  await link.waitFor();
  const label = (await link.getAttribute("aria-label")) ?? "";
  return Number(/, (\d+) new$/.exec(label)?.[1] ?? 0);
}

/** Reloads until the header shows `count` unread notices (they arrive with the next poll). */
async function waitForUnread(page: Page, count: number) {
  for (let attempt = 0; attempt < 15; attempt++) {
    if ((await unreadCount(page)) === count) return;
    await page.waitForTimeout(400);
    await page.reload();
  }
  expect(await unreadCount(page)).toBe(count);
}

const unreadNotice = (page: Page, text: string) =>
  page.getByRole("button", { name: `New: ${text}` });

async function openReview(page: Page) {
  await page.goto(reviewUrl());
  await page.getByRole("heading", { name: `Review: ${PLAN}` }).waitFor();
}

const statusBadge = (page: Page, label: string) =>
  page.locator("header").getByText(label, { exact: true });

describe("team review in the browser", () => {
  it("lets the lead create a plan and submit it for review from the Review screen", async () => {
    const { page } = lead;
    await page.getByRole("link", { name: "Sites" }).click();
    await page.getByRole("link", { name: SITE }).click();
    await page.getByRole("button", { name: "New plan" }).click();
    await page.getByLabel("Plan name").fill(PLAN);
    await page.getByRole("button", { name: "Create plan" }).click();
    await page.waitForURL(/\/plans\/[0-9a-f-]{36}$/);
    planId = new URL(page.url()).pathname.split("/")[2];

    await openReview(page);
    await statusBadge(page, "Draft").waitFor();
    await page
      .getByRole("table", { name: /^Resolvability of / })
      .first()
      .waitFor();
    await page
      .getByLabel("Note for the reviewers")
      .fill("First layout: hammer source, 24 channels.");
    await page.getByRole("button", { name: "Submit for review" }).click();
    await statusBadge(page, "In review").waitFor();
    expect(await page.getByRole("button", { name: "Submit for review" }).count()).toBe(0);
    await screenshot(page, "review-lead-submitted");
  });

  it("tells the reviewer, who asks for changes only with a note and mentions the lead", async () => {
    const { page } = reviewer;
    await waitForUnread(page, reviewerUnread + 1);
    await page.getByRole("link", { name: /^Inbox/ }).click();
    const notice = unreadNotice(page, `${LEAD_NAME} submitted “${PLAN}” (revision 1)`);
    await notice.waitFor();
    await screenshot(page, "review-reviewer-inbox");
    await notice.click();
    await page.getByRole("heading", { name: `Review: ${PLAN}` }).waitFor();
    expect(page.url()).toBe(reviewUrl());
    await statusBadge(page, "In review").waitFor();

    // A comment anchored to the spread's first shot, mentioning the lead through the suggestions.
    const box = page.getByRole("combobox", { name: "New note" });
    await box.click();
    await box.pressSequentially("@Tob");
    await page.getByRole("option", { name: new RegExp(LEAD_NAME) }).waitFor();
    await page.keyboard.press("Enter");
    await box.pressSequentially(
      "the spacing is too coarse to sample the soil layer from this shot.",
    );
    const pointsAt = page.getByLabel("Points at");
    const firstShot = (await pointsAt.locator("option").allTextContents()).find((t) =>
      t.startsWith("Shot 1"),
    );
    expect(firstShot).toBeTruthy();
    await pointsAt.selectOption({ label: firstShot! });
    await page.getByRole("button", { name: "Post note" }).click();
    const thread = page.getByRole("article", { name: `Note started by ${REVIEWER_NAME}` });
    await thread.getByText(`@${LEAD_NAME}`).waitFor();
    await thread.getByText(firstShot!).waitFor();
    expect(await pointsAt.inputValue()).toBe("");

    await page.getByRole("button", { name: "↺ Return to lead with notes" }).click();
    await page.getByText("say what needs to change").waitFor();
    await screenshot(page, "review-reviewer-note-required");
    await page
      .getByLabel("Note for the survey lead")
      .fill("Halve the geophone spacing and keep the spread length.");
    await page.getByRole("button", { name: "↺ Return to lead with notes" }).click();
    await statusBadge(page, "Returned with notes").waitFor();
    await page.getByLabel("Latest note").getByText("Halve the geophone spacing").waitFor();
    await screenshot(page, "review-reviewer-changes-requested");
  });

  it("tells the lead, who replies, revises the spread in the designer and submits again", async () => {
    const { page } = lead;
    await waitForUnread(page, leadUnread + 2);
    await page.getByRole("link", { name: /^Inbox/ }).click();
    await unreadNotice(
      page,
      `${REVIEWER_NAME} mentioned you in a review note on “${PLAN}”`,
    ).waitFor();
    const decision = unreadNotice(page, `${REVIEWER_NAME} returned with notes “${PLAN}”`);
    await decision.waitFor();
    await screenshot(page, "review-lead-inbox");
    await decision.click();
    await page.getByRole("heading", { name: `Review: ${PLAN}` }).waitFor();
    await statusBadge(page, "Returned with notes").waitFor();

    const thread = page.getByRole("article", { name: `Note started by ${REVIEWER_NAME}` });
    await thread.getByRole("button", { name: "Reply" }).click();
    await thread
      .getByRole("combobox", { name: `Reply to ${REVIEWER_NAME}` })
      .fill("Done in the next revision: half the spacing, twice the channels.");
    await thread.getByRole("button", { name: "Post reply" }).click();
    await thread
      .getByRole("list", { name: "Replies" })
      .getByText("Done in the next revision")
      .waitFor();

    await page.getByRole("link", { name: "Edit in the designer" }).click();
    await page.waitForURL(new RegExp(`/plans/${planId}(\\?.*)?$`));
    await page.getByRole("tab", { name: "Spread" }).click();
    const spacing = page.getByLabel(/^Spacing \(/);
    const before = await spacing.inputValue();
    expect(Number(before)).toBeGreaterThan(0);
    await spacing.fill(String(Number(before) / 2));
    const channels = page.getByLabel("Channels", { exact: true });
    const channelsBefore = Number(await channels.inputValue());
    await channels.fill(String(channelsBefore * 2));
    await page.getByRole("button", { name: "Save" }).click();
    await page.getByText("revision 2", { exact: false }).first().waitFor();

    await openReview(page);
    await page.getByRole("tab", { name: "History" }).click();
    await page.getByRole("list", { name: "Revisions" }).getByText("Revision 2").waitFor();
    const diff = page.getByLabel("Changes from revision 1 to 2");
    await diff.getByText("geophone spacing:").waitFor();
    expect(await diff.locator("del").first().textContent()).toContain(before);
    await diff.getByText("channels:").waitFor();
    expect(await diff.locator("ins").nth(1).textContent()).toBe(String(channelsBefore * 2));
    await screenshot(page, "review-lead-history-diff");

    await page.getByRole("tab", { name: "Activity" }).click();
    await page
      .getByRole("list", { name: "Activity" })
      .getByText("returned the plan to the lead with notes")
      .waitFor();
    expect(await page.getByRole("link", { name: "Download CSV" }).getAttribute("href")).toBe(
      `/api/plans/${planId}/activity.csv`,
    );

    await page.getByRole("button", { name: "Submit for review" }).click();
    await statusBadge(page, "In review").waitFor();
  });

  it("tells the reviewer again, who approves; the lead then sees the approval and may reopen", async () => {
    const rp = reviewer.page;
    await rp.goto(`${app.url}/inbox`);
    await unreadNotice(rp, `${LEAD_NAME} replied to a review note on “${PLAN}”`).waitFor();
    await unreadNotice(rp, `${LEAD_NAME} submitted “${PLAN}” (revision 2)`).waitFor();
    await screenshot(rp, "review-reviewer-inbox-again");
    await rp.getByRole("button", { name: "Mark all seen" }).click();
    await waitForUnread(rp, 0);

    await openReview(rp);
    await rp.getByRole("tab", { name: "History" }).click();
    await rp.getByLabel("Changes from revision 1 to 2").getByText("geophone spacing:").waitFor();
    await rp.getByLabel("Note for the survey lead").fill("Spacing now samples the lens. Approved.");
    await rp.getByRole("button", { name: "✓ Sign off for mobilisation" }).click();
    await statusBadge(rp, "Signed off").waitFor();
    expect(await rp.getByRole("button", { name: "✓ Sign off for mobilisation" }).count()).toBe(0);
    await screenshot(rp, "review-reviewer-approved");

    const lp = lead.page;
    // Still unread: the mention; new: the approval.
    await waitForUnread(lp, leadUnread + 2);
    await lp.getByRole("link", { name: /^Inbox/ }).click();
    await unreadNotice(
      lp,
      `${REVIEWER_NAME} signed off for mobilisation “${PLAN}” (revision 2)`,
    ).click();
    await lp.getByRole("heading", { name: `Review: ${PLAN}` }).waitFor();
    await statusBadge(lp, "Signed off").waitFor();
    await lp.getByRole("button", { name: "Start a new revision" }).waitFor();
    await screenshot(lp, "review-lead-approved");
  });

  it("shows the reviewer the anchored threads beside the shot in the designer, and takes a comment on a layer there", async () => {
    const { page } = reviewer;
    await page.goto(`${app.url}/plans/${planId}?edit=spread`);
    await page.getByRole("heading", { name: PLAN }).waitFor();
    await page.getByText("· read only").waitFor();

    // The thread started on the Review screen, anchored to shot 1, with the lead's reply.
    const shotChip = page.getByRole("button", { name: "Comments on shot 1 (1 open)" });
    await shotChip.click();
    const shotPanel = page.getByRole("dialog", { name: "Comments on shot 1" });
    const thread = shotPanel.getByRole("article", { name: `Note started by ${REVIEWER_NAME}` });
    await thread.getByText("the spacing is too coarse").waitFor();
    await thread.getByText("Done in the next revision").waitFor();
    await screenshot(page, "review-designer-shot-comments");
    await page.keyboard.press("Escape");
    await shotPanel.waitFor({ state: "detached" });

    // A new comment on layer 2, opened from the keyboard on the read-only plan.
    await page.getByRole("tab", { name: "Ground models" }).click();
    const layerChip = page.getByRole("button", { name: "Comments on layer 2" });
    await layerChip.focus();
    await page.keyboard.press("Enter");
    const layerPanel = page.getByRole("dialog", { name: "Comments on layer 2" });
    await layerPanel
      .getByRole("combobox", { name: /^New note on Layer 2/ })
      .fill("Borehole BH2 puts the base of this layer a metre deeper; worth a sweep.");
    await layerPanel.getByRole("button", { name: "Post note" }).click();
    await layerPanel
      .getByRole("list", { name: "Review notes" })
      .getByText("Borehole BH2 puts the base")
      .waitFor();
    await page.getByRole("button", { name: "Comments on layer 2 (1 open)" }).waitFor();
    await screenshot(page, "review-designer-layer-comment");

    // The Review screen lists it, pointing at the layer.
    await page.getByRole("link", { name: "Review", exact: true }).click();
    await page.getByRole("heading", { name: `Review: ${PLAN}` }).waitFor();
    const posted = page
      .getByRole("article", { name: `Note started by ${REVIEWER_NAME}` })
      .filter({ hasText: "Borehole BH2 puts the base" });
    await posted.getByTitle(/^Layer 2 · /).waitFor();
  });

  it("has e-mailed every notice with a link to the plan's review", async () => {
    const admin = await openBrowser();
    try {
      await signIn(admin.page, app.url, demoAccounts.admin);
      await admin.page.goto(`${app.url}/mailbox`);
      const list = admin.page.getByRole("list", { name: "Messages" });
      for (const subject of [
        `Review requested: ${PLAN}`,
        `You were mentioned on ${PLAN}`,
        `New reply on ${PLAN}`,
      ]) {
        await list.getByText(subject).first().waitFor();
      }
      expect(await list.getByText(`Review decision: ${PLAN}`).count()).toBe(2);
      await list.getByText(`Review decision: ${PLAN}`).first().click();
      await admin.page
        .getByRole("link", { name: `${app.url}/plans/${planId}/review` })
        .first()
        .waitFor();
      await screenshot(admin.page, "review-mailbox");
    } finally {
      await admin.close();
    }
  });

  it("sends a reviewer whose session ended elsewhere to sign in, and back to the review", async () => {
    const { page, context } = reviewer;
    await openReview(page);
    // The session ends outside this tab (signed out on another device).
    const cookie = (await context.cookies()).find((c) => c.name === "spreadsight_session");
    expect(cookie).toBeTruthy();
    const ended = await fetch(`${app.url}/api/auth/sign-out`, {
      method: "POST",
      headers: { Origin: app.url, Cookie: `spreadsight_session=${cookie!.value}` },
    });
    expect(ended.status).toBe(204);

    // The next thing the page sends to the server meets the ended session.
    await page.getByLabel("New note").fill("One more look at the centre shot.");
    await page.getByRole("button", { name: "Post note" }).click();
    await page.getByRole("heading", { name: "Sign in" }).waitFor();
    await page.getByText("Your session has ended").waitFor();
    await screenshot(page, "review-session-ended");
    await page.getByLabel("E-mail").fill(demoAccounts.reviewer);
    await page.getByLabel("Password").fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByRole("heading", { name: `Review: ${PLAN}` }).waitFor();
    expect(new URL(page.url()).pathname).toBe(`/plans/${planId}/review`);
  });
});
