// The addresses we put in e-mails: pages of the web app, on the public origin.
export function appLink(origin: string, path: string): string {
  return new URL(path, origin).toString();
}
