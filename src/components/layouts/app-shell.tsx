import type { ReactNode } from "react";
import { NavLink } from "react-router";
import { LogOut, type LucideIcon } from "lucide-react";
import { cn } from "@/utils/cn";
import { Brand } from "../ui/brand";
import { SkipLink } from "./skip-link";
import { useFocusMainOnNavigate } from "./use-focus-main-on-navigate";

export type ShellNavItem = { label: string; to: string; icon: LucideIcon };

/**
 * The staff frame. One <nav aria-label="Main">: a scrolling strip of large tabs under the top bar on phones and
 * tablets, a sidebar from 1024px (its list scrolls on short screens, so the foot stays in view). The user's name,
 * role and "Sign out" sit top right, or at the sidebar's foot.
 */
export function AppShell({
  nav,
  userName,
  roleLabel,
  onSignOut,
  signingOut,
  children,
}: {
  nav: ShellNavItem[];
  userName: string;
  roleLabel: string;
  onSignOut: () => void;
  signingOut: boolean;
  children: ReactNode;
}) {
  const mainRef = useFocusMainOnNavigate();
  return (
    <div className="min-h-dvh lg:grid lg:grid-cols-[15rem_minmax(0,1fr)] lg:bg-[linear-gradient(to_right,#0b1020_15rem,transparent_15rem)]">
      <SkipLink />
      <header className="on-dark sticky top-0 z-30 grid grid-cols-[1fr_auto] items-center bg-ink-950 text-white shadow-raised lg:h-dvh lg:grid-cols-1 lg:grid-rows-[auto_1fr_auto] lg:items-stretch lg:shadow-none">
        <div className="flex h-14 items-center px-4 lg:h-16 lg:px-5">
          <Brand />
        </div>
        <nav aria-label="Main" className="scrollbar-thin relative col-span-2 row-start-2 overflow-x-auto border-t border-white/10 lg:col-span-1 lg:min-h-0 lg:overflow-x-visible lg:overflow-y-auto lg:border-t-0">
          <ul className="flex gap-1 px-2 py-1.5 lg:flex-col lg:px-3 lg:py-2">
            {nav.map(({ label, to, icon: Icon }) => (
              <li key={to} className="shrink-0">
                <NavLink
                  to={to}
                  className={({ isActive }) =>
                    cn(
                      "flex min-h-11 items-center gap-2.5 rounded-lg px-3 text-sm font-semibold whitespace-nowrap transition-colors lg:min-h-12 lg:text-[0.95rem]",
                      isActive ? "bg-white text-ink-950" : "text-ink-100 hover:bg-white/10 hover:text-white",
                    )
                  }
                >
                  <Icon aria-hidden className="size-5 shrink-0" />
                  {label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
        <div className="col-start-2 row-start-1 flex items-center gap-2 pr-2 lg:col-start-1 lg:row-start-3 lg:flex-col lg:items-stretch lg:gap-3 lg:border-t lg:border-white/10 lg:p-4">
          <p className="max-w-[7.5rem] min-w-0 text-right text-xs leading-tight sm:max-w-none sm:text-sm lg:text-left">
            <span className="block truncate font-semibold text-white">{userName}</span>
            <span className="block text-ink-200">{roleLabel}</span>
          </p>
          <button
            type="button"
            onClick={onSignOut}
            disabled={signingOut}
            className="inline-flex min-h-11 items-center justify-center gap-2 rounded-lg px-3 text-sm font-semibold text-ink-100 ring-1 ring-white/20 hover:bg-white/10 hover:text-white disabled:opacity-60"
          >
            <LogOut aria-hidden className="size-4" />
            Sign out
          </button>
        </div>
      </header>
      <main id="main" ref={mainRef} tabIndex={-1} className="min-w-0 px-4 py-6 outline-none sm:px-6 lg:px-8 lg:py-8">
        {children}
      </main>
    </div>
  );
}
