// The demo band's accounts, as the seed creates them.
import { DEMO_ACCOUNTS, DEMO_BAND, DEMO_BAND_ID } from "../../../db/seed";

export { DEMO_BAND, DEMO_BAND_ID };

export interface DemoAccount {
  email: string;
  password: string;
  role: string;
}

function byRole(role: string): DemoAccount {
  const found = (DEMO_ACCOUNTS as readonly DemoAccount[]).find((a) => a.role === role);
  if (!found) throw new Error(`the demo seed has no ${role}`);
  return found;
}

export const demoLeader = () => byRole("leader");
export const demoPlayer = () => byRole("player");
