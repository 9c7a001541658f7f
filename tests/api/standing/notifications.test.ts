import { describe, expect, it } from "vitest";
import request from "supertest";
import { useTestApp } from "../../support/test-app.ts";
import { buildProvider } from "../../fixtures/build-credential-row.ts";
import { Notification } from "../../../server/notices/index.ts";
import { signIn } from "./sign-in-as.ts";

const t = useTestApp();

async function notify(userId: number, title: string, createdAt: Date) {
  return Notification.create({
    userId,
    kind: "credential_lapsing",
    title,
    body: `${title}.`,
    link: null,
    noticeId: null,
    createdAt,
  });
}

describe("notifications", () => {
  it("lists the user's own notifications newest first with the unread count", async () => {
    const p = await buildProvider();
    const other = await buildProvider();
    await notify(p.admin.id, "Older", new Date("2027-01-01T00:00:00Z"));
    await notify(p.admin.id, "Newer", new Date("2027-01-02T00:00:00Z"));
    await notify(other.admin.id, "Not yours", new Date("2027-01-03T00:00:00Z"));

    const res = await (await signIn(t.app, p.admin.email)).get("/api/notifications");

    expect(res.status).toBe(200);
    expect(res.body.unreadCount).toBe(2);
    expect(res.body.notifications.map((n: { title: string }) => n.title)).toEqual(["Newer", "Older"]);
  });

  it("marks one as read, then all as read", async () => {
    const p = await buildProvider();
    const first = await notify(p.admin.id, "First", new Date());
    await notify(p.admin.id, "Second", new Date());
    const agent = await signIn(t.app, p.admin.email);

    const one = await agent.post(`/api/notifications/${first.id}/read`);
    const afterOne = await agent.get("/api/notifications");
    const all = await agent.post("/api/notifications/read-all");
    const afterAll_ = await agent.get("/api/notifications");

    expect(one.status).toBe(200);
    expect(one.body.readAt).not.toBeNull();
    expect(afterOne.body.unreadCount).toBe(1);
    expect(all.body).toEqual({ marked: 1 });
    expect(afterAll_.body.unreadCount).toBe(0);
  });

  it("answers 404 for another user's notification and 401 when signed out", async () => {
    const p = await buildProvider();
    const other = await buildProvider();
    const theirs = await notify(other.admin.id, "Theirs", new Date());

    const foreign = await (await signIn(t.app, p.admin.email)).post(`/api/notifications/${theirs.id}/read`);
    const anonymous = await request(t.app).get("/api/notifications");

    expect(foreign.status).toBe(404);
    expect(anonymous.status).toBe(401);
    expect((await Notification.findByPk(theirs.id))?.readAt).toBeNull();
  });
});
