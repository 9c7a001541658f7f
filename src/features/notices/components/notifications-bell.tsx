import { useCallback, useId, useRef, useState } from "react";
import { Link } from "react-router-dom";
import { useDismiss } from "@/components/layouts/use-dismiss.ts";
import { formatDateTime } from "@/lib/format-date-time.ts";
import { useNotifications } from "../api/get-notifications.ts";
import { useMarkAllNotificationsRead } from "../api/mark-all-notifications-read.ts";
import { useMarkNotificationRead } from "../api/mark-notification-read.ts";
import { inAppPath } from "./in-app-path.ts";

/** The header's bell: unread count in its name, a list of notices, and marking them read. */
export function NotificationsBell() {
  const [open, setOpen] = useState(false);
  const close = useCallback(() => setOpen(false), []);
  const root = useRef<HTMLDivElement>(null);
  const panelId = useId();
  const { data } = useNotifications();
  const markOne = useMarkNotificationRead();
  const markAll = useMarkAllNotificationsRead();
  useDismiss(root, open, close);
  const unread = data?.unreadCount ?? 0;
  const items = data?.notifications ?? [];

  return (
    <div ref={root} className="relative">
      <button
        type="button"
        aria-label={`Notifications, ${unread} unread`}
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((o) => !o)}
        className="relative flex min-h-11 min-w-11 items-center justify-center rounded-md text-ink-50 hover:bg-ink-800 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent-400"
      >
        <svg viewBox="0 0 20 20" className="size-5" aria-hidden="true" focusable="false">
          <path
            d="M10 2.5a5 5 0 0 0-5 5v3.5L3.5 14h13L15 11V7.5a5 5 0 0 0-5-5zM8 16a2 2 0 0 0 4 0"
            className="fill-none stroke-current"
            strokeWidth="1.5"
          />
        </svg>
        {unread > 0 && (
          <span
            aria-hidden="true"
            className="absolute -top-0.5 -right-0.5 min-w-5 rounded-full bg-accent-500 px-1 text-center text-xs font-semibold text-ink-900"
          >
            {unread > 99 ? "99+" : unread}
          </span>
        )}
      </button>
      {open && (
        <div
          id={panelId}
          className="fixed inset-x-4 top-16 z-30 rounded-lg md:absolute md:inset-x-auto md:top-auto md:right-0 md:mt-2 md:w-96 border border-ink-100 bg-white p-2 text-ink-900 shadow-lg"
        >
          <div className="flex items-center justify-between gap-2 border-b border-ink-100 px-2 pb-2">
            <h2 className="text-sm font-semibold">Notifications</h2>
            {unread > 0 && (
              <button
                type="button"
                onClick={() => markAll.mutate()}
                disabled={markAll.isPending}
                className="min-h-9 rounded-md px-2 text-sm text-ink-700 underline underline-offset-2 hover:bg-ink-50 focus-visible:outline-2 focus-visible:outline-ink-700"
              >
                Mark all read
              </button>
            )}
          </div>
          {items.length === 0 ? (
            <p className="px-2 py-4 text-sm text-ink-700">No notifications.</p>
          ) : (
            <ul className="max-h-96 divide-y divide-ink-100 overflow-y-auto">
              {items.map((item) => (
                <li key={item.id} className="px-2 py-2 text-sm">
                  <p className="flex items-start gap-2">
                    <span aria-hidden="true" className="mt-0.5">
                      {item.readAt ? "○" : "●"}
                    </span>
                    <span>
                      <span className="font-semibold">{item.readAt ? "" : "Unread: "}</span>
                      {item.link ? (
                        <Link
                          to={inAppPath(item.link)}
                          onClick={close}
                          className="font-semibold underline underline-offset-2"
                        >
                          {item.title}
                        </Link>
                      ) : (
                        <span className="font-semibold">{item.title}</span>
                      )}
                    </span>
                  </p>
                  <p className="mt-0.5 pl-5 text-ink-800">{item.body}</p>
                  <p className="mt-0.5 flex items-center justify-between gap-2 pl-5 text-xs text-ink-700">
                    {formatDateTime(item.createdAt)}
                    {!item.readAt && (
                      <button
                        type="button"
                        onClick={() => markOne.mutate(item.id)}
                        className="min-h-8 rounded-md px-2 text-sm underline underline-offset-2 hover:bg-ink-50 focus-visible:outline-2 focus-visible:outline-ink-700"
                      >
                        Mark read<span className="sr-only">: {item.title}</span>
                      </button>
                    )}
                  </p>
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </div>
  );
}
