// Every statement node-postgres sends from this process, recorded: pg's Client.prototype.query is wrapped,
// and every pooled connection's query goes through it. For tests and benchmarks that count or replay what
// an in-process API sent while answering a request.
import pg from 'pg';

export interface SentStatement {
  /** The connection that sent it (to tell one transaction from another). */
  client: unknown;
  /** The query as passed to pg: text, or a query config. */
  query: string | pg.QueryConfig;
  text: string;
  values: unknown[];
}

export interface StatementLog {
  /** The statements sent since the last take (or since recording began), and a fresh start. */
  take(): SentStatement[];
  /** Puts pg's own query method back. */
  stop(): void;
}

export function recordStatements(): StatementLog {
  let sent: SentStatement[] = [];
  const proto = pg.Client.prototype as unknown as { query: (...args: unknown[]) => unknown };
  const original = proto.query;
  proto.query = function (this: unknown, ...args: unknown[]) {
    const [query, values] = args as [string | pg.QueryConfig, unknown];
    const text = typeof query === 'string' ? query : (query?.text ?? '');
    const given = typeof query === 'object' && Array.isArray(query?.values) ? query.values : Array.isArray(values) ? values : [];
    sent.push({ client: this, query, text, values: given });
    return original.apply(this, args);
  };
  return {
    take() {
      const taken = sent;
      sent = [];
      return taken;
    },
    stop() {
      proto.query = original;
    },
  };
}
