export { sendMail, MailMessageSchema, type MailMessage } from "./send";
export { magicLinkMail, passwordChangedMail, passwordResetMail, type MailContent } from "./templates";
