import type { ReactNode } from 'react';
import { LogoMark } from '@/components/shell/logo-mark';

// Signed-out area: a narrow ink column that says what the place is, the form beside it.
export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="grid min-h-screen md:grid-cols-[minmax(18rem,26rem)_1fr]">
      <aside className="relative hidden overflow-hidden bg-ink-900 px-10 py-12 text-paper-100 md:flex md:flex-col">
        <div className="flex items-center gap-2.5 text-lg font-semibold tracking-tight text-paper-50">
          <LogoMark className="h-8 w-8" />
          Branchwise
        </div>
        <p className="mt-10 max-w-xs text-base leading-7 text-paper-100">
          The review board where your group gates phonon dispersions before they are used.
        </p>
        <ul className="mt-6 space-y-2 text-sm text-ink-200">
          <li>Upload band files from any code.</li>
          <li>Screening points out what needs a second look.</li>
          <li>Reviewers discuss, decide and keep the record.</li>
        </ul>
        <BranchesArt />
      </aside>
      <main id="main" className="flex items-start justify-center px-4 py-12 sm:px-8 md:items-center">
        <div className="w-full max-w-md">
          <div className="mb-6 flex items-center gap-2 font-semibold md:hidden">
            <LogoMark />
            Branchwise
          </div>
          {children}
        </div>
      </main>
    </div>
  );
}

function BranchesArt() {
  // Decorative: branches leaving Γ and meeting again at the zone edge.
  return (
    <svg viewBox="0 0 320 220" className="pointer-events-none absolute inset-x-0 bottom-6 h-56 w-full" aria-hidden="true">
      <path d="M12 190 H308" className="stroke-ink-700" strokeWidth="1" />
      <path d="M24 190 V30 M296 190 V30" className="stroke-ink-700" strokeWidth="1" strokeDasharray="2 4" />
      <path d="M24 190 C 94 84, 184 54, 296 64" fill="none" className="stroke-ember-400" strokeWidth="2" />
      <path d="M24 190 C 104 124, 194 104, 296 114" fill="none" className="stroke-ink-300" strokeWidth="1.6" />
      <path d="M24 190 C 114 164, 204 154, 296 154" fill="none" className="stroke-ink-500" strokeWidth="1.4" />
      <path d="M24 46 C 124 40, 224 34, 296 40" fill="none" className="stroke-ink-500" strokeWidth="1.2" />
      <path d="M24 62 C 124 70, 224 78, 296 74" fill="none" className="stroke-ink-600" strokeWidth="1.2" />
      <circle cx="24" cy="190" r="4" className="fill-paper-50" />
      <text x="24" y="210" className="fill-ink-200 font-sans text-[12px]" textAnchor="middle">
        Γ
      </text>
      <text x="296" y="210" className="fill-ink-200 font-sans text-[12px]" textAnchor="middle">
        X
      </text>
    </svg>
  );
}
