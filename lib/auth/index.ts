export {
  currentUser,
  requirePageRole,
  requirePageUser,
  requireRole,
  requireUser,
  role,
  signedIn,
  userFromRequest,
  type SessionUser,
} from "./guard";
export { roleSatisfies } from "./roles";
