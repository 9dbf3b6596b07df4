vcl 4.1;

# Fairweigh behind Varnish (docs/operations.md): anonymous readers of public pages and files share one
# cached copy; anything personal (a session cookie, an embargoed version, the desk, the API's writes)
# passes straight to the app and is never kept. The app says what may be kept (Cache-Control), files
# each public answer under its brief's surrogate keys, and asks for a purge by key when the brief
# changes (a correction, a withdrawal, a published translation, a moved release). xkey comes from
# Debian's varnish-modules.
#
# The backends are in backends.vcl beside this file: one `backend` per app process and a round-robin
# director named `app` (npm run check:cdn writes one; deploy/varnish/backends.example.vcl shows the shape).

import std;
import xkey;
import directors;

include "./backends.vcl";

# Who may purge: the app's processes, on this machine.
acl purgers {
  "127.0.0.1";
  "::1";
}

sub vcl_recv {
  set req.backend_hint = app.backend();

  # The app's purge hook (PURGE_URL): POST /.purge with the keys in Surrogate-Key, space separated.
  if (req.url == "/.purge") {
    if (req.method != "POST" || client.ip !~ purgers) {
      return (synth(403, "Not allowed"));
    }
    set req.http.x-purged = xkey.purge(req.http.Surrogate-Key);
    return (synth(200, "Purged " + req.http.x-purged + " objects"));
  }

  if (req.method != "GET" && req.method != "HEAD") {
    return (pass);
  }

  # A signed-in reader (press, editors, the desk) may see what others may not: never a shared copy,
  # never kept. Their requests go to the app with every cookie.
  if (req.http.Cookie ~ "(^|;\s*)(__Host-)?fairweigh\.session=") {
    return (pass);
  }
  if (req.url ~ "^/(desk|preview|api/(session|csrf|translations|briefs|people|audit|messages|press-room|dev))(/|\?|$)") {
    return (pass);
  }

  # Anonymous: the only cookie a public page reads is the reader's choice of language (on the few
  # addresses that negotiate it, which say so with Vary: Cookie). Every other cookie is dropped, so
  # that it neither splits the cache nor reaches a page that others share.
  if (req.http.Cookie) {
    set req.http.Cookie = ";" + req.http.Cookie;
    set req.http.Cookie = regsuball(req.http.Cookie, ";\s*", ";");
    set req.http.Cookie = regsuball(req.http.Cookie, ";(fairweigh\.locale)=", "; \1=");
    set req.http.Cookie = regsuball(req.http.Cookie, ";[^ ][^;]*", "");
    set req.http.Cookie = regsub(req.http.Cookie, "^[; ]+|[; ]+$", "");
    if (req.http.Cookie == "") {
      unset req.http.Cookie;
    }
  }
  return (hash);
}

sub vcl_backend_response {
  # xkey reads the keys from its own header.
  if (beresp.http.Surrogate-Key) {
    set beresp.http.xkey = beresp.http.Surrogate-Key;
  }
  # An answer that sets a cookie or is marked private is somebody's own: not kept (Varnish's built-in
  # rule does the same; said here so that nothing below can change it).
  if (beresp.http.Set-Cookie || beresp.http.Cache-Control ~ "(?i)private|no-store") {
    set beresp.uncacheable = true;
    set beresp.ttl = 120s;
    return (deliver);
  }
  # A 404 may become a page later (an embargoed version at its release): kept briefly at most.
  if (beresp.status == 404 && beresp.ttl > 10s) {
    set beresp.ttl = 10s;
  }
}

sub vcl_deliver {
  # For the check (and for people debugging): whether the cache answered.
  if (obj.hits > 0) {
    set resp.http.X-Cache = "hit";
  } else {
    set resp.http.X-Cache = "miss";
  }
  unset resp.http.xkey;
}
