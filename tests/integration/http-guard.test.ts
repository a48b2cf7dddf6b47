import http from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { guardRequest, pathDecodes, PERMISSIONS_POLICY } from "../../server/http-guard";

// The custom server's front door, with a stand-in for Next behind it that answers 405 with an empty body the way
// the framework does for a method a route does not export. tests/e2e/hostile-requests.spec.ts checks the real build.
describe("the custom server's request guard", () => {
  let url = "";
  let server: http.Server;
  let reached = 0;
  beforeAll(async () => {
    server = http.createServer((req, res) => {
      if (!guardRequest(req, res)) return;
      reached++;
      if (req.method === "PATCH") {
        res.statusCode = 405;
        res.setHeader("Allow", "GET, POST");
        res.flushHeaders(); // as Next's stream piping does, writing an empty chunk before the end
        res.write(new Uint8Array(0));
        res.end();
        return;
      }
      res.setHeader("content-type", "application/json");
      res.end(JSON.stringify({ ok: true }));
    });
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", () => r()));
    url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  });
  afterAll(() => new Promise<void>((r) => server.close(() => r())));

  it("answers a malformed %-escape with 400 in the error shape before the framework sees it [RFC-3986]", async () => {
    // RFC 3986 §2.1: a percent sign must be followed by two hex digits; %E0%A4%A is a truncated UTF-8 sequence.
    expect(pathDecodes("/api/sales/%zz")).toBe(false);
    expect(pathDecodes("/lots/%E0%A4%A")).toBe(false);
    expect(pathDecodes("/lots/%E0%A4%A4?q=%zz")).toBe(true);
    const before = reached;
    for (const path of ["/api/sales/%zz", "/lots/%E0%A4%A"]) {
      const r = await fetch(url + path);
      expect(r.status).toBe(400);
      expect(r.headers.get("content-type")).toContain("application/json");
      expect(await r.json()).toEqual({ error: { code: "bad_request", message: expect.any(String) } });
    }
    expect(reached).toBe(before);
  });

  it("gives an empty 405 the error shape and keeps Allow", async () => {
    const r = await fetch(`${url}/api/sales`, { method: "PATCH" });
    expect(r.status).toBe(405);
    expect(r.headers.get("allow")).toBe("GET, POST");
    expect(await r.json()).toEqual({ error: { code: "method_not_allowed", message: expect.any(String) } });
  });

  it("sets Permissions-Policy on every answer and private, no-store on a signed-in API answer [SUG]", async () => {
    const page = await fetch(`${url}/catalogue`);
    expect(page.headers.get("permissions-policy")).toBe(PERMISSIONS_POLICY);
    expect((await fetch(`${url}/api/sales/%zz`)).headers.get("permissions-policy")).toBe(PERMISSIONS_POLICY);
    const signedIn = await fetch(`${url}/api/me`, { headers: { cookie: "next-auth.session-token=abc" } });
    expect(signedIn.headers.get("cache-control")).toBe("private, no-store");
    const anonymous = await fetch(`${url}/api/me`);
    expect(anonymous.headers.get("cache-control")).toBeNull();
  });
});
