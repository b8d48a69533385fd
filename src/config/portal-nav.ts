import { CircleUserRound, ListChecks, ReceiptText } from "lucide-react";
import type { ShellNavItem } from "@/components/layouts/app-shell";
import { paths } from "./paths";

/** The customer portal's navigation (apart from the staff menu, so the portal downloads none of it). */
export const PORTAL_NAV: ShellNavItem[] = [
  { label: "My jobs", to: paths.portal, icon: ListChecks },
  { label: "My quotes", to: paths.portalQuotes, icon: ReceiptText },
  { label: "Account", to: paths.portalAccount, icon: CircleUserRound },
];
