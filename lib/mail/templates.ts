// The mails Shuntbook sends, each as plain text (what every client shows) and a small HTML
// version with the same words. The HTML is a single column with inline styles and no images or
// remote assets, so it reads the same in a phone's mail app and a terminal client.

export type MailContent = { subject: string; text: string; html: string };

const escape = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#39;");

function layout(opts: { heading: string; paragraphs: string[]; action?: { label: string; url: string }; footer: string }): string {
  const body = opts.paragraphs.map((p) => `<p style="margin:0 0 14px">${escape(p)}</p>`).join("");
  const button = opts.action
    ? `<p style="margin:20px 0"><a href="${escape(opts.action.url)}" style="display:inline-block;background:#1d3b2f;color:#ffffff;padding:12px 20px;border-radius:6px;text-decoration:none;font-weight:bold">${escape(opts.action.label)}</a></p>
<p style="margin:0 0 14px;font-size:13px;color:#555">If the button does nothing, copy this address into your browser:<br><span style="word-break:break-all">${escape(opts.action.url)}</span></p>`
    : "";
  return `<!doctype html><html><body style="margin:0;padding:24px;background:#f7f3ea;font-family:Verdana,Arial,sans-serif;font-size:15px;line-height:1.5;color:#1a1a1a">
<div style="max-width:520px;margin:0 auto;background:#ffffff;border:1px solid #d9d2c3;border-radius:8px;padding:24px">
<p style="margin:0 0 18px;font-weight:bold;letter-spacing:2px;text-transform:uppercase">Shuntbook</p>
<h1 style="font-size:20px;margin:0 0 16px">${escape(opts.heading)}</h1>
${body}${button}
<p style="margin:24px 0 0;font-size:13px;color:#555">${escape(opts.footer)}</p>
</div></body></html>`;
}

export function magicLinkMail(opts: { url: string; minutes: number }): MailContent {
  const heading = "Your sign-in link";
  const lines = [
    "Someone (hopefully you) asked to sign in to Shuntbook with this e-mail address.",
    `The link below signs you in. It works once, and only for the next ${opts.minutes} minutes.`,
  ];
  const footer = "Did not ask for this? Ignore this mail; nobody can sign in without the link.";
  return {
    subject: "Sign in to Shuntbook",
    text: `${heading}\n\n${lines.join("\n\n")}\n\n${opts.url}\n\n${footer}\n`,
    html: layout({ heading, paragraphs: lines, action: { label: "Sign in to Shuntbook", url: opts.url }, footer }),
  };
}

export function passwordResetMail(opts: { name: string; url: string; minutes: number }): MailContent {
  const heading = "Choose a new password";
  const lines = [
    `Hello ${opts.name},`,
    "A new password was requested for your Shuntbook account. Follow the link to choose one.",
    `The link works once, for the next ${opts.minutes} minutes. Your current password keeps working until you set a new one.`,
  ];
  const footer = "Did not ask for this? Ignore this mail; your password stays as it is.";
  return {
    subject: "Reset your Shuntbook password",
    text: `${heading}\n\n${lines.join("\n\n")}\n\n${opts.url}\n\n${footer}\n`,
    html: layout({ heading, paragraphs: lines, action: { label: "Choose a new password", url: opts.url }, footer }),
  };
}

export function passwordChangedMail(opts: { name: string; signInUrl: string }): MailContent {
  const heading = "Your password was changed";
  const lines = [
    `Hello ${opts.name},`,
    "The password of your Shuntbook account has just been changed.",
    "If that was you, there is nothing to do. If not, ask for a reset link on the sign-in page straight away.",
  ];
  const footer = "This notice goes out on every password change and cannot be switched off.";
  return {
    subject: "Your Shuntbook password was changed",
    text: `${heading}\n\n${lines.join("\n\n")}\n\n${opts.signInUrl}\n\n${footer}\n`,
    html: layout({ heading, paragraphs: lines, action: { label: "Open the sign-in page", url: opts.signInUrl }, footer }),
  };
}

export function signUpConfirmMail(opts: { name: string; url: string; hours: number }): MailContent {
  const heading = "Finish your account";
  const lines = [
    `Hello ${opts.name},`,
    "Someone (hopefully you) asked for a Shuntbook account with this e-mail address.",
    `Follow the link and enter the password you chose to finish it. The link works once, for the next ${opts.hours} hours.`,
  ];
  const footer = "Did not ask for this? Ignore this mail; no account is made without the link.";
  return {
    subject: "Finish your Shuntbook account",
    text: `${heading}\n\n${lines.join("\n\n")}\n\n${opts.url}\n\n${footer}\n`,
    html: layout({ heading, paragraphs: lines, action: { label: "Finish my account", url: opts.url }, footer }),
  };
}

export function signUpExistingMail(opts: { name: string; signInUrl: string; resetUrl: string }): MailContent {
  const heading = "You already have an account";
  const lines = [
    `Hello ${opts.name},`,
    "Someone just tried to open a new Shuntbook account with this e-mail address. It already has one: yours.",
    `If it was you, sign in instead. Forgotten the password? Ask for a new one here: ${opts.resetUrl}`,
  ];
  const footer = "Did not ask for this? Ignore this mail; nothing about your account has changed.";
  return {
    subject: "Your Shuntbook account already exists",
    text: `${heading}\n\n${lines.join("\n\n")}\n\n${opts.signInUrl}\n\n${footer}\n`,
    html: layout({ heading, paragraphs: lines, action: { label: "Open the sign-in page", url: opts.signInUrl }, footer }),
  };
}
