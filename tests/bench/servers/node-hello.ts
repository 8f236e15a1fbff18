// The floor: Node's own http server answering a short JSON body, nothing else.
import http from 'node:http';
import type { AddressInfo } from 'node:net';

const server = http.createServer((_req, res) => {
  res.writeHead(200, { 'content-type': 'application/json' });
  res.end('{"hello":"world"}');
});
server.listen(0, '127.0.0.1', () => process.send!({ port: (server.address() as AddressInfo).port }));
