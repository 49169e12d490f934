/* global window, document, location, navigator, localStorage */
// Starts the session renewal (POST /api/auth/refresh with the httpOnly cookie) as soon as the page is parsed,
// while the dashboard's own code is still downloading: Angular's first guard would otherwise ask only after
// bootstrap, about half a second later. The Auth service takes this answer over (core/session-head-start.ts)
// and never sends a second renewal beside it, since the server treats a reused refresh token as theft.
// On a system's live view it then asks for that system's status and description with the new access token, so
// they are here by the time the view's code is (core/live-head-start.ts takes both over), and paints the status's
// values at once as a first glance outside Angular's root; the live view removes it once its own tiles show
// (live/first-glance.ts). Angular cannot set up the shell and the view that fast on a small machine.
// Public pages (sign-in, invitation, password reset) do not renew: none of them asks for a session.
// index.html names it in its head and the build copies it unhashed (a browser may keep it an hour): the globals
// it sets (cwSessionHeadStart, cwStatusHeadStart, cwSystemHeadStart) must stay readable by older and newer apps.
(function () {
  // The remembered theme (core/theme.ts keeps it) applies before the first paint, not when Angular starts.
  try {
    var theme = localStorage.getItem('cellwarden.theme');
    if (theme === 'dark' || theme === 'light') document.documentElement.classList.add('cw-' + theme);
  } catch {
    // Storage refused (private mode): the system's colour scheme applies until Angular runs.
  }
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
  var ask = function (path) {
    return renewal.then(function (session) {
      if (!session.body) return { status: session.status, body: null };
      return fetch('/api/systems/' + encodeURIComponent(systemId) + path, {
        credentials: 'same-origin',
        headers: { Accept: 'application/json', Authorization: 'Bearer ' + session.body.accessToken },
      }).then(answer, unreachable);
    });
  };
  var status = ask('/status');
  var system = ask('');
  window.cwStatusHeadStart = { systemId: systemId, answer: status };
  window.cwSystemHeadStart = { systemId: systemId, answer: system };
  Promise.all([status, system])
    .then(function (answers) {
      if (answers[0].body && answers[1].body)
        paintFirstGlance(answers[0].body.status, answers[1].body.system);
    })
    .catch(function () {
      // Nothing painted: the live view shows everything once it runs.
    });

  // The locale the dashboard picks (core/locale.ts resolveLocale): the first of the browser's languages whose
  // data it carries, the exact tag, else its language, else en-US.
  var CARRIED =
    'en-GB en-AU en-CA en-IE en-NZ de de-AT de-CH fr fr-CA nl es it sv da nb fi pl pt pt-PT'.split(' ');
  function dashboardLocale() {
    var languages =
      navigator.languages && navigator.languages.length ? navigator.languages : [navigator.language];
    for (var i = 0; i < languages.length; i++) {
      if (!languages[i]) continue;
      var tag;
      try {
        tag = Intl.getCanonicalLocales(languages[i].replace('_', '-'))[0] || languages[i];
      } catch {
        tag = languages[i];
      }
      if (tag === 'en' || tag === 'en-US') return 'en-US';
      if (CARRIED.indexOf(tag) >= 0) return tag;
      var language = tag.split('-')[0];
      if (language === 'no' || language === 'nn') language = 'nb';
      if (language === 'en') return 'en-US';
      if (CARRIED.indexOf(language) >= 0) return language;
    }
    return 'en-US';
  }

  // Titles of the flags, as the flag catalogue words them (shared/src/analytics/flag-catalogue.ts; the spec
  // holds the two together).
  var FLAG_TITLES = {
    'low-charge': 'Battery charge is low',
    'low-voltage': 'Battery voltage is low',
    'cold-charging': 'Charging a battery that is too cold',
    'cold-charge-ahead': 'Battery will soon be too cold to charge',
    'hot-charging': 'Charging a battery that is too hot',
    'cold-charge-current': 'Charge current too high for a cold battery',
    'over-temperature': 'Battery is too hot',
    'over-discharge': 'Drawing more current than the BMS is rated for',
    'bms-cutoff-suspected': 'Battery may have switched itself off',
    'device-silent': 'No readings from the monitor',
    'charger-under-delivering': 'A charger is delivering less than expected',
    'soc-disagreement': 'State of charge readings disagree',
    'circuit-near-rating': 'A circuit’s current is near or over a rating',
  };

  // The flags the live view lists first (live/live-state.ts seedLiveState, live.ts withColdCharge): the derived
  // state's, the open alerts', and charging below freezing seen in the reading itself before the server's
  // minimum duration has passed.
  function activeFlags(status, system, current) {
    var flags = {};
    var add = function (kind, severity) {
      flags[kind] = severity === 'critical' || flags[kind] === 'critical' ? 'critical' : 'warning';
    };
    ((status.derived && status.derived.activeFlags) || []).forEach(function (f) {
      add(f.kind, f.severity);
    });
    (status.activeAlerts || []).forEach(function (a) {
      if (a.endedAt === null) add(a.kind, a.severity);
    });
    var r = status.latestReading;
    // live/cold-charge.ts: LiFePO4, more than 0.5 A in, below 0 °C.
    if (current && system.chemistry === 'lifepo4' && r.current > 0.5 && r.temperature < 0)
      add('cold-charging', 'critical');
    return Object.keys(flags).map(function (kind) {
      return { kind: kind, severity: flags[kind] };
    });
  }

  function element(tag, className, text) {
    var made = document.createElement(tag);
    if (className) made.className = className;
    if (text !== undefined) made.textContent = text;
    return made;
  }

  function paintFirstGlance(status, system) {
    var r = status && status.latestReading;
    // Nothing to paint without a reading, and nothing once the live view shows its own values or message.
    if (!r || !system || document.querySelector('#cw-first-glance, cw-live .tiles, cw-live .problem')) return;
    var locale = dashboardLocale();
    var number = function (value, digits) {
      return new Intl.NumberFormat(locale, {
        minimumFractionDigits: digits,
        maximumFractionDigits: digits,
      }).format(value);
    };
    // core/staleness.ts: older than two minutes is never shown as current (no interval is known yet).
    var current = Date.now() - r.measuredAt <= 2 * 60 * 1000;
    var glance = element('section', 'cw-first-glance');
    glance.id = 'cw-first-glance';
    glance.setAttribute('aria-labelledby', 'cw-first-glance-title');
    glance.appendChild(element('h1', null, system.name)).id = 'cw-first-glance-title';
    var when = new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short' }).format(
      r.measuredAt,
    );
    glance.appendChild(
      element(
        'p',
        current ? 'cw-first-glance-note' : 'cw-first-glance-note stale',
        current
          ? 'Latest reading, ' + when + '. The full live view is on its way.'
          : 'Not current: the last reading is from ' + when + '. The full live view is on its way.',
      ),
    );
    var flags = activeFlags(status, system, current);
    if (flags.length) {
      var list = element('ul', 'cw-first-glance-flags');
      list.setAttribute('aria-label', 'Active flags');
      flags.forEach(function (f) {
        var item = element('li', f.severity === 'critical' ? 'critical' : null);
        item.appendChild(element('strong', null, f.severity === 'critical' ? 'Critical: ' : 'Warning: '));
        item.appendChild(document.createTextNode(FLAG_TITLES[f.kind] || f.kind));
        list.appendChild(item);
      });
      glance.appendChild(list);
    }
    var soc =
      status.derived && status.derived.stateOfCharge != null ? status.derived.stateOfCharge : r.stateOfCharge;
    var direction = r.current > 0.1 ? 'into the pack' : r.current < -0.1 ? 'out of the pack' : 'idle';
    var values = element('dl', current ? 'cw-first-glance-values' : 'cw-first-glance-values stale');
    [
      soc != null ? ['State of charge', number(soc, 0) + ' %'] : null,
      ['Voltage', number(r.voltage, 2) + ' V'],
      ['Current', number(r.current, 1) + ' A', direction],
      ['Power', number(r.power != null ? r.power : r.voltage * r.current, 0) + ' W'],
    ].forEach(function (tile) {
      if (!tile) return;
      var box = element('div', 'cw-first-glance-tile');
      box.appendChild(element('dt', null, tile[0]));
      var value = element('dd');
      value.appendChild(element('span', 'cw-first-glance-value', tile[1]));
      if (tile[2]) value.appendChild(element('span', 'cw-first-glance-direction', tile[2]));
      box.appendChild(value);
      values.appendChild(box);
    });
    glance.appendChild(values);
    document.body.appendChild(glance);
    // Any key or pointer ends the first glance: what it covers becomes usable at once, and focus never lands
    // behind it.
    var leave = function () {
      if (glance.parentNode) glance.parentNode.removeChild(glance);
      ['keydown', 'pointerdown', 'focusin'].forEach(function (type) {
        document.removeEventListener(type, leave, true);
      });
    };
    ['keydown', 'pointerdown', 'focusin'].forEach(function (type) {
      document.addEventListener(type, leave, true);
    });
  }
})();
