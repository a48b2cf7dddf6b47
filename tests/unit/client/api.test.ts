// Check values: [SUG] how our client helper sends each kind of body to our routes.
import { describe, expect, it } from "vitest";
import { requestInit } from "@/lib/client/api";

describe("apiFetch's request", () => {
  it("reads with GET when nothing is sent", () => {
    const init = requestInit({});
    expect(init.method).toBe("GET");
    expect(init.body).toBeUndefined();
    expect(init.headers).toBeUndefined();
  });

  it("sends JSON as application/json with POST by default", () => {
    const init = requestInit({ json: { a: 1 } });
    expect(init.method).toBe("POST");
    expect(init.headers).toEqual({ "content-type": "application/json" });
    expect(init.body).toBe('{"a":1}');
  });

  it("sends text with the type it is given (text/plain otherwise)", () => {
    expect(requestInit({ body: "code,maker_name\n", contentType: "text/csv" }).headers).toEqual({
      "content-type": "text/csv",
    });
    expect(requestInit({ body: "x" }).headers).toEqual({ "content-type": "text/plain" });
  });

  it("leaves FormData's type to the browser, which adds the multipart boundary", () => {
    const form = new FormData();
    form.append("file", new Blob(["x"]), "x.jpg");
    const init = requestInit({ body: form });
    expect(init.method).toBe("POST");
    expect(init.headers).toBeUndefined();
    expect(init.body).toBe(form);
  });

  it("keeps an explicit method, such as DELETE", () => {
    expect(requestInit({ method: "DELETE" }).method).toBe("DELETE");
  });
});
