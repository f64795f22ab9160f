import Link from 'next/link';

/** The 404 in our voice. It never says whether something exists and is hidden from you. */
export function NotFoundView() {
  return (
    <div className="mx-auto max-w-lg py-16 text-center" data-testid="not-found">
      <svg viewBox="0 0 120 60" className="mx-auto h-14 w-28" aria-hidden="true">
        <path d="M4 56 H116" className="stroke-paper-400" strokeWidth="1.5" />
        <path d="M10 56 C 30 30, 48 22, 58 20" fill="none" className="stroke-ink-600" strokeWidth="2" />
        <path d="M66 20 C 80 18, 96 16, 112 15" fill="none" className="stroke-ink-600" strokeWidth="2" strokeDasharray="3 4" />
        <circle cx="10" cy="56" r="3.5" className="fill-ink-800" />
        <circle cx="62" cy="20" r="3" className="fill-none stroke-ember-500" strokeWidth="1.5" />
      </svg>
      <p className="mt-4 text-xs font-semibold uppercase tracking-wider text-paper-600">404 · not found</p>
      <h1 className="mt-1 text-xl font-semibold tracking-tight">This branch ends here</h1>
      <p className="mt-2 text-paper-700">
        There is no page at this address, or it belongs to a group you are not a member of.
      </p>
      <p className="mt-5">
        <Link href="/">Back to my groups</Link>
      </p>
    </div>
  );
}
