// A port on 127.0.0.1 that nothing listens on: for a service that cannot be reached.
import net from 'node:net';

/** A port the system just handed out and that was closed again at once. */
export async function closedPort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise((resolve) => server.close(resolve));
  return port;
}
