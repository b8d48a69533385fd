import type { LucideIcon } from "lucide-react";
import { CalendarRange, ChartColumn, CreditCard, History, Leaf, Settings } from "lucide-react";
import { CircleUserRound, Columns3, FlaskConical, Inbox, Layers, ListChecks, Package, ReceiptText, Users, Contact, SprayCan, Palette } from "lucide-react";
import type { Access, Role } from "@shared/domain/roles";
import { paths } from "./paths";

export type NavItem = {
  /** The link's accessible name; end-to-end tests rely on these. */
  label: string;
  to: string;
  icon: LucideIcon;
  access: Access;
  /** Only where the server runs the demo stand-ins. */
  demoOnly?: boolean;
  /** Planned: listed here so the slot is obvious, hidden until its screen exists. */
  planned?: boolean;
  /** Narrower than the access group: only these roles see the entry (the route itself may still allow more). */
  roles?: readonly Role[];
};

/** The staff navigation, in order. A role sees the items its access group allows. (The portal's is in portal-nav.ts.) */
export const STAFF_NAV: NavItem[] = [
  { label: "Dashboard", to: paths.dashboard, icon: ChartColumn, access: "office" },
  { label: "Board", to: paths.board, icon: Columns3, access: "staff" },
  { label: "Jobs", to: paths.jobs, icon: ListChecks, access: "staff" },
  { label: "Booth", to: paths.boothIndex, icon: SprayCan, access: "staff", roles: ["painter", "owner"] },
  { label: "Schedule", to: paths.schedule, icon: CalendarRange, access: "office" },
  { label: "Customers", to: paths.customers, icon: Contact, access: "office" },
  { label: "Quotes", to: paths.quotes, icon: ReceiptText, access: "office" },
  { label: "Plans", to: paths.plans, icon: Layers, access: "staff" },
  { label: "Mix calculator", to: paths.mixCalculator, icon: FlaskConical, access: "staff" },
  { label: "Materials", to: paths.materials, icon: Package, access: "staff" },
  { label: "Test panels", to: paths.panels, icon: Palette, access: "staff" },
  { label: "Payments", to: paths.payments, icon: CreditCard, access: "owner" },
  { label: "VOC log", to: paths.compliance, icon: Leaf, access: "office" },
  { label: "Users", to: paths.users, icon: Users, access: "owner" },
  { label: "Audit", to: paths.audit, icon: History, access: "owner" },
  { label: "Settings", to: paths.settings, icon: Settings, access: "office" },
  { label: "Outbox", to: paths.outbox, icon: Inbox, access: "owner", demoOnly: true },
  { label: "Account", to: paths.account, icon: CircleUserRound, access: "staff" },
];
