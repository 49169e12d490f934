/* global window, location */
// Starts the session renewal (POST /api/auth/refresh with the httpOnly cookie) as soon as the page is parsed,
// while the dashboard's own code is still downloading: Angular's first guard would otherwise ask only after
// bootstrap, about half a second later. The Auth service takes this answer over (core/session-head-start.ts)
// and never sends a second renewal beside it, since the server treats a reused refresh token as theft.
// On a system's live view it then asks for that system's status with the new access token, so the first
// values are here by the time the view's code is (core/live-head-start.ts takes it over).
// Public pages (sign-in, invitation, password reset) do not renew: none of them asks for a session.
(function () {
  if (/^\/(sign-in|invitation\/|password-reset)/.test(location.pathname)) return;
  var answer = function (response) {
    return response.ok
      ? response.json().then(function (body) {
          return { status: response.status, body: body };
        })
      : { status: response.status, body: null };
  };
  // No connection: status 0, as Angular's HttpClient reports it.
  var unreachable = function () {
    return { status: 0, body: null };
  };
  var renewal = fetch('/api/auth/refresh', {
    method: 'POST',
    credentials: 'same-origin',
    headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
    body: '{}',
  }).then(answer, unreachable);
  window.cwSessionHeadStart = renewal;

  var live = /^\/systems\/(?!new\/?$)([^/]+)\/?$/.exec(location.pathname);
  if (!live) return;
  var systemId = decodeURIComponent(live[1]);
  window.cwStatusHeadStart = {
    systemId: systemId,
    answer: renewal.then(function (session) {
      if (!session.body) return { status: session.status, body: null };
      return fetch('/api/systems/' + encodeURIComponent(systemId) + '/status', {
        credentials: 'same-origin',
        headers: { Accept: 'application/json', Authorization: 'Bearer ' + session.body.accessToken },
      }).then(answer, unreachable);
    }),
  };
})();
