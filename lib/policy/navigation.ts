/** What each person sees in the app's frame: the menu and how their job list is named. */
import type { Actor, Role } from "@/lib/domain/roles";

export interface NavItem {
  readonly href: string;
  readonly label: string;
}

/** How the jobs list is named for this role, and what it holds. */
export function jobListWords(role: Role): { heading: string; scope: string; showCustomer: boolean } {
  switch (role) {
    case "installer":
      return { heading: "My jobs", scope: " assigned to you", showCustomer: true };
    case "customer":
      return { heading: "Our jobs", scope: " for your company", showCustomer: false };
    default:
      return { heading: "Jobs", scope: "", showCustomer: true };
  }
}

/** Navigation entries per role: what each person needs in their working day. */
export function navigationFor(actor: Pick<Actor, "role">): NavItem[] {
  const jobs: NavItem = { href: "/jobs", label: jobListWords(actor.role).heading };
  switch (actor.role) {
    case "admin":
      return [jobs, { href: "/registers", label: "Registers" }];
    case "engineer":
      return [jobs, { href: "/registers/heads", label: "Heads" }];
    case "inspector":
    case "installer":
    case "customer":
      return [jobs];
  }
}
