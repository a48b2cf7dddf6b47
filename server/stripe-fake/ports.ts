// Binding a server on 127.0.0.1: a fixed port, any free port (0), or the first free port of a range.
import type { Server } from "node:http";
import type { AddressInfo } from "node:net";

function listenOnce(server: Server, host: string, port: number): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (e: Error) => reject(e);
    server.once("error", onError);
    server.listen(port, host, () => {
      server.off("error", onError);
      resolve((server.address() as AddressInfo).port);
    });
  });
}

/**
 * Listens on `port`, or on a free port of `[first, last]` (tried from a random start, so parallel test
 * workers rarely collide). Resolves with the bound port.
 */
export async function listenOn(server: Server, host: string, port: number | [number, number]): Promise<number> {
  if (typeof port === "number") return listenOnce(server, host, port);
  const [first, last] = port;
  const size = last - first + 1;
  const offset = Math.floor(Math.random() * size);
  for (let i = 0; i < size; i++) {
    const candidate = first + ((offset + i) % size);
    try {
      return await listenOnce(server, host, candidate);
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== "EADDRINUSE") throw e;
    }
  }
  throw new Error(`no free port in ${first}-${last}`);
}
