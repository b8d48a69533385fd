import type { ReactNode } from "react";
import { Brand } from "../ui/brand";

/** The signed-out pages: a form card on the left, the product's promise on the ink panel (from tablet width). */
export function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="grid min-h-dvh md:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
      <main id="main" className="flex flex-col px-5 py-8 sm:px-10">
        <Brand tone="dark" />
        <div className="mx-auto flex w-full max-w-sm flex-1 flex-col justify-center py-10">{children}</div>
        <p className="text-xs text-primer-700">Coatwright · jobs, finishes and mixes for custom paint shops</p>
      </main>
      <aside aria-label="About Coatwright" className="on-dark relative hidden overflow-hidden bg-ink-950 p-12 text-white md:flex md:flex-col md:justify-end">
        <div aria-hidden className="absolute inset-0">
          <div className="absolute -top-24 -right-24 size-[28rem] rounded-full bg-candy-600/35 blur-3xl" />
          <div className="absolute top-1/3 -left-20 size-72 rounded-full bg-flake-400/20 blur-3xl" />
          <div className="absolute right-10 bottom-10 size-64 rounded-full bg-ink-500/40 blur-3xl" />
        </div>
        <div className="relative max-w-md">
          <p className="text-3xl leading-tight font-bold">Every coat planned, mixed and logged.</p>
          <p className="mt-4 text-ink-100">
            From the first inquiry to the last buff: jobs on one board, layer stacks and mix sheets at the booth, and a record
            of what went on so the finish can be matched years from now.
          </p>
        </div>
      </aside>
    </div>
  );
}
