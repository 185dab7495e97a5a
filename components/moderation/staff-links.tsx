import { unstable_rethrow } from "next/navigation";
import { NavLink } from "@/components/nav-link";
import { roleSatisfies } from "@/lib/auth/roles";
import { currentUser } from "@/lib/auth/guard";

// "Moderation" for moderators and admins, "Admin" for admins. The role is read fresh (as every
// guard does), and a failed session read hides the links rather than taking the page down.
export async function StaffLinks() {
  let role = null;
  try {
    role = (await currentUser())?.role ?? null;
  } catch (error) {
    unstable_rethrow(error);
  }
  if (!role || !roleSatisfies(role, ["moderator"])) return null;
  return (
    <>
      <li>
        <NavLink href="/moderation">Moderation</NavLink>
      </li>
      {roleSatisfies(role, ["admin"]) && (
        <li>
          <NavLink href="/admin">Admin</NavLink>
        </li>
      )}
    </>
  );
}
