import type { ReactNode } from "react";
import { NavLink } from "react-router";
import { LogOut } from "lucide-react";
import { cn } from "@/utils/cn";
import { Brand } from "../ui/brand";
import type { ShellNavItem } from "./app-shell";
import { SkipLink } from "./skip-link";
import { useFocusMainOnNavigate } from "./use-focus-main-on-navigate";

/** The customer portal's frame: phone first, one column, nothing of the shop's internals. */
export function PortalShell({
  nav,
  userName,
  onSignOut,
  signingOut,
  children,
}: {
  nav: ShellNavItem[];
  userName: string;
  onSignOut: () => void;
  signingOut: boolean;
  children: ReactNode;
}) {
  const mainRef = useFocusMainOnNavigate();
  return (
    <div className="min-h-dvh">
      <SkipLink />
      <header className="on-dark bg-ink-950 text-white">
        <div className="mx-auto flex h-14 max-w-3xl items-center justify-between gap-3 px-4">
          <Brand />
          <div className="flex items-center gap-3">
            <span className="hidden truncate text-sm text-ink-100 sm:inline">{userName}</span>
            <button
              type="button"
              onClick={onSignOut}
              disabled={signingOut}
              className="inline-flex min-h-11 items-center gap-2 rounded-lg px-3 text-sm font-semibold text-ink-100 ring-1 ring-white/20 hover:bg-white/10 hover:text-white disabled:opacity-60"
            >
              <LogOut aria-hidden className="size-4" />
              Sign out
            </button>
          </div>
        </div>
        <nav aria-label="Main" className="mx-auto max-w-3xl px-2">
          <ul className="flex gap-1">
            {nav.map(({ label, to, icon: Icon }) => (
              <li key={to}>
                <NavLink
                  to={to}
                  end
                  className={({ isActive }) =>
                    cn(
                      "flex min-h-12 items-center gap-2 border-b-4 px-3 text-sm font-semibold",
                      isActive ? "border-candy-400 text-white" : "border-transparent text-ink-200 hover:text-white",
                    )
                  }
                >
                  <Icon aria-hidden className="size-5" />
                  {label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
      </header>
      <main id="main" ref={mainRef} tabIndex={-1} className="mx-auto max-w-3xl px-4 py-6 outline-none">
        {children}
      </main>
    </div>
  );
}
