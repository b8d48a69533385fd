export const ROLES = ["owner", "estimator", "painter", "customer"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  owner: "Owner",
  estimator: "Estimator",
  painter: "Painter",
  customer: "Customer",
};

/** Named groups of roles used by the server's permission guard and the client's navigation. */
export const ACCESS = {
  signedIn: ["owner", "estimator", "painter", "customer"],
  staff: ["owner", "estimator", "painter"],
  office: ["owner", "estimator"],
  owner: ["owner"],
  customer: ["customer"],
} as const satisfies Record<string, readonly Role[]>;
export type Access = keyof typeof ACCESS;

export function roleCan(role: Role | undefined, access: Access): boolean {
  return role !== undefined && (ACCESS[access] as readonly Role[]).includes(role);
}
