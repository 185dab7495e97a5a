export { currentUser, requirePageRole, requirePageUser, requireRole, requireUser, userFromRequest, type SessionUser } from "./guard";
export { roleSatisfies } from "./roles";
