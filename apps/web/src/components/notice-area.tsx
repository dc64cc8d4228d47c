import { dismissNotice, useNotices } from '../lib/notices';

/** Where background failures are announced; a polite live region so they never interrupt. */
export function NoticeArea() {
  const notices = useNotices();
  return (
    <div aria-live="polite" className="fixed inset-x-4 bottom-4 z-40 flex flex-col items-end gap-2 desk:left-auto desk:w-96 print:hidden">
      {notices.map((notice) => (
        <div key={notice.id} className="flex w-full items-start gap-3 rounded border border-line-strong bg-surface p-3 text-base text-ink shadow-lg desk:text-sm">
          <p className="flex-1">{notice.message}</p>
          <button
            type="button"
            onClick={() => dismissNotice(notice.id)}
            className="-m-2 min-h-touch min-w-touch rounded px-2 text-ink-muted hover:text-ink desk:min-h-control desk:min-w-control"
          >
            Dismiss
          </button>
        </div>
      ))}
    </div>
  );
}
