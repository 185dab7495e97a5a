import { unstable_rethrow } from "next/navigation";
import { NavLink } from "@/components/nav-link";
import { currentUser } from "@/lib/auth/guard";

// "Garage" in the header, for signed-in people only (visitors have no garage). Like the account
// corner, a failed session read hides the link rather than taking the page down.
export async function GarageLink() {
  let signedIn = false;
  try {
    signedIn = (await currentUser()) != null;
  } catch (error) {
    unstable_rethrow(error);
  }
  if (!signedIn) return null;
  return (
    <li>
      <NavLink href="/garage">Garage</NavLink>
    </li>
  );
}
