export { currentUser, requirePageRole, requirePageUser, requireRole, requireUser, type SessionUser } from "./guard";
