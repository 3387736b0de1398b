import "server-only";
import { DEMO_PASSWORD, DEMO_USERS } from "@/db/demo/users";
import { ROLE_LABELS } from "@/lib/auth/roles";

// Demo mode shows the seeded users on the sign-in page. It is on unless LOOPSHIFT_DEMO=off, so
// that a fresh `npm start` is usable at once; a real deployment turns it off.
export function isDemoMode(): boolean {
  return (process.env.LOOPSHIFT_DEMO ?? "on") !== "off";
}

export function demoUsers() {
  return DEMO_USERS.map((u) => ({
    email: u.email,
    label: ROLE_LABELS[u.role],
    password: DEMO_PASSWORD,
  }));
}
