// The public address of the app, for links in e-mails: they are opened outside any request, so
// they must be absolute. `npm start` always sets NEXTAUTH_URL.
export function appUrl(path = "/"): string {
  const base = (process.env.NEXTAUTH_URL || `http://localhost:${process.env.PORT || 3000}`).replace(
    /\/+$/,
    "",
  );
  return `${base}${path.startsWith("/") ? path : `/${path}`}`;
}
