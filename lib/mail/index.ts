export { sendMail, MailMessageSchema, type MailMessage } from "./send";
