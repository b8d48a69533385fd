import type { Role } from "@shared/domain/roles";

/** Every address in the app, in one place. */
export const paths = {
  home: "/",
  signIn: "/sign-in",
  forgotPassword: "/forgot-password",
  resetPassword: "/reset-password",
  board: "/board",
  jobs: "/jobs",
  newJob: "/jobs/new",
  job: (id: number) => `/jobs/${id}`,
  customers: "/customers",
  newCustomer: "/customers/new",
  customer: (id: number) => `/customers/${id}`,
  users: "/users",
  outbox: "/outbox",
  account: "/account",
  materials: "/materials",
  newMaterial: "/materials/new",
  material: (id: number) => `/materials/${id}`,
  plans: "/plans",
  newPlan: "/plans/new",
  plan: (id: number) => `/plans/${id}`,
  planVersion: (id: number, versionId: number) => `/plans/${id}/versions/${versionId}`,
  jobPlan: (jobId: number) => `/jobs/${jobId}/plan`,
  mixSheet: (id: number) => `/mix-sheets/${id}`,
  mixCalculator: "/mix",
  boothIndex: "/booth",
  booth: (jobId: number) => `/booth/${jobId}`,
  jobPrep: (jobId: number) => `/jobs/${jobId}/prep`,
  jobInspection: (jobId: number) => `/jobs/${jobId}/inspection`,
  jobTicket: (jobId: number) => `/jobs/${jobId}/ticket`,
  jobFinishRecord: (jobId: number) => `/jobs/${jobId}/finish-record`,
  panels: "/panels",
  panel: (id: number) => `/panels/${id}`,
  newPanel: (jobId?: number) => (jobId ? `/panels/new?jobId=${jobId}` : "/panels/new"),
  panelsCompare: (ids: number[]) => `/panels/compare?ids=${ids.join(",")}`,
  panelsLadder: (ground: string, candy: string) => `/panels/ladder?${new URLSearchParams({ ground, candy })}`,
  quotes: "/quotes",
  quote: (id: number) => `/quotes/${id}`,
  dashboard: "/dashboard",
  compliance: "/compliance",
  audit: "/audit",
  payments: "/payments",
  schedule: "/schedule",
  settings: "/settings",
  portal: "/portal",
  portalAccount: "/portal/account",
  portalQuotes: "/portal/quotes",
  portalQuote: (id: number) => `/portal/quotes/${id}`,
  portalJob: (id: number) => `/portal/jobs/${id}`,
  portalJobColour: (id: number) => `/portal/jobs/${id}/colour`,
  portalFinishRecord: (id: number) => `/portal/jobs/${id}/finish-record`,
  portalLink: (token: string) => `/portal/link/${token}`,
  portalChangeOrder: (id: number) => `/portal/change-orders/${id}`,
} as const;

/** Where each role lands after signing in. */
export function homePathFor(role: Role): string {
  return role === "customer" ? paths.portal : paths.board;
}

/** A `next` address from the query string, if it is a path inside this app. */
export function safeNextPath(next: string | null): string | null {
  if (!next || !next.startsWith("/") || next.startsWith("//") || next.startsWith("/\\")) return null;
  if (next.startsWith(paths.signIn)) return null;
  return next;
}
