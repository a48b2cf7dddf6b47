// Local mail catcher for development, demo and tests: an SMTP server that
// keeps every message on disk and a small inbox (HTML and JSON) to read them.
//   SMTP  127.0.0.1:$MAIL_CATCHER_SMTP_PORT (1025)
//   Inbox http://127.0.0.1:$MAIL_CATCHER_HTTP_PORT (1080)  — /api/messages[?to=…]
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import http from "node:http";
import path from "node:path";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

const SMTP_PORT = Number(process.env.MAIL_CATCHER_SMTP_PORT ?? 1025);
const HTTP_PORT = Number(process.env.MAIL_CATCHER_HTTP_PORT ?? 1080);
const DIR = path.resolve(process.env.MAIL_CATCHER_DIR ?? ".data/mail");
mkdirSync(DIR, { recursive: true });

type Stored = {
  id: string;
  to: string[];
  from: string;
  subject: string;
  text: string;
  html: string | null;
  receivedAt: string;
  attachments: { filename: string; contentType: string; size: number }[];
};

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS", "AUTH"],
  logger: false,
  size: 10 * 1024 * 1024,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((mail) => {
        const id = `${Date.now()}-${Math.random().toString(36).slice(2, 8)}`;
        const rec: Stored = {
          id,
          to: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
          subject: mail.subject ?? "",
          text: mail.text ?? "",
          html: typeof mail.html === "string" ? mail.html : null,
          attachments: mail.attachments.map((a) => ({
            filename: a.filename ?? "",
            contentType: a.contentType,
            size: a.size,
          })),
          receivedAt: new Date().toISOString(),
        };
        writeFileSync(path.join(DIR, `${id}.json`), JSON.stringify(rec));
        callback();
      })
      .catch((e) => callback(e as Error));
  },
});

function all(): Stored[] {
  return readdirSync(DIR)
    .filter((f) => f.endsWith(".json"))
    .sort()
    .reverse()
    .map((f) => JSON.parse(readFileSync(path.join(DIR, f), "utf8")) as Stored);
}

const esc = (s: string) => s.replace(/[&<>"]/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;" })[c]!);
const linkify = (s: string) => esc(s).replace(/(https?:\/\/[^\s<]+)/g, '<a href="$1">$1</a>');

const web = http.createServer((req, res) => {
  const url = new URL(req.url ?? "/", "http://x");
  const json = (code: number, body: unknown) => {
    res.writeHead(code, { "content-type": "application/json" });
    res.end(JSON.stringify(body));
  };
  if (url.pathname === "/api/messages" && req.method === "GET") {
    const to = url.searchParams.get("to")?.toLowerCase();
    return json(
      200,
      all().filter((m) => !to || m.to.includes(to)),
    );
  }
  if (url.pathname === "/api/messages" && req.method === "DELETE") {
    for (const f of readdirSync(DIR)) rmSync(path.join(DIR, f));
    return json(200, { deleted: true });
  }
  const one = url.pathname.match(/^\/api\/messages\/([\w-]+)$/);
  if (one) {
    const m = all().find((x) => x.id === one[1]);
    return m ? json(200, m) : json(404, { error: { code: "not_found", message: "No such message" } });
  }
  if (url.pathname === "/") {
    const rows = all()
      .map(
        (m) =>
          `<article><h2>${esc(m.subject)}</h2><p class="meta">To ${esc(m.to.join(", "))} · ${esc(m.receivedAt)}${(m.attachments ?? []).length ? ` · attached: ${esc(m.attachments.map((a) => a.filename).join(", "))}` : ""}</p><pre>${linkify(m.text)}</pre></article>`,
      )
      .join("");
    res.writeHead(200, { "content-type": "text/html; charset=utf-8" });
    return res.end(`<!doctype html><html lang="en"><meta charset="utf-8"><title>Getterline local inbox</title>
<style>body{font:15px system-ui,sans-serif;max-width:52rem;margin:2rem auto;color:#1c1d21}article{border:1px solid #d9dadd;border-radius:6px;padding:0 1rem;margin:1rem 0}.meta{color:#565961}pre{white-space:pre-wrap}</style>
<h1>Local inbox</h1><p>Every e-mail Getterline sends in development and demo lands here; nothing leaves this machine.</p>${rows || "<p>No mail yet.</p>"}</html>`);
  }
  json(404, { error: { code: "not_found", message: "Not found" } });
});

smtp.listen(SMTP_PORT, "127.0.0.1", () => {
  web.listen(HTTP_PORT, "127.0.0.1", () =>
    console.log(`mail catcher: SMTP 127.0.0.1:${SMTP_PORT}, inbox http://127.0.0.1:${HTTP_PORT}`),
  );
});

function stop() {
  web.close();
  smtp.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 2000).unref();
}
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
