/**
 * The report page's script (plain browser JavaScript, no libraries). Builds the record list from the embedded
 * JSON with textContent only, and filters it by search text, check, severity and declared form.
 */
export const PAGE_SCRIPT = `
(function () {
  'use strict';
  var rows = JSON.parse(document.getElementById('report-data').textContent);
  var list = document.getElementById('records');
  var empty = document.getElementById('empty');
  var shown = document.getElementById('shown-count');
  var search = document.getElementById('search');
  var fCheck = document.getElementById('filter-check');
  var fSev = document.getElementById('filter-severity');
  var fForm = document.getElementById('filter-form');
  function el(tag, cls, text) {
    var e = document.createElement(tag);
    if (cls) e.className = cls;
    if (text !== undefined) e.textContent = text;
    return e;
  }
  function fill(select, values) {
    values.sort().forEach(function (v) { var o = el('option', '', v); o.value = v; select.appendChild(o); });
  }
  var checks = {}, forms = {};
  rows.forEach(function (r) { forms[r.form] = 1; r.findings.forEach(function (f) { checks[f.check] = 1; }); });
  fill(fCheck, Object.keys(checks));
  fill(fForm, Object.keys(forms));
  var nodes = rows.map(function (r) {
    var box = el('article', 'rec');
    box.setAttribute('data-id', r.id);
    var pic = el('div', 'pic');
    if (r.svg) { var img = el('img'); img.alt = 'structure of ' + r.id + ' with computed CIP labels'; img.src = r.svg; pic.appendChild(img); }
    else pic.appendChild(el('div', 'nodepict', 'no depiction'));
    box.appendChild(pic);
    var body = el('div', 'body');
    body.appendChild(el('h3', '', r.id));
    body.appendChild(el('div', 'file', r.file));
    var side = el('div', 'side');
    var d = el('div'); d.appendChild(el('b', '', 'declared')); d.appendChild(document.createTextNode(r.form + (r.descriptors ? ' ' + r.descriptors : ''))); side.appendChild(d);
    var c = el('div'); c.appendChild(el('b', '', 'computed')); c.appendChild(document.createTextNode(r.computed + (r.labels ? '; CIP ' + r.labels : ''))); side.appendChild(c);
    body.appendChild(side);
    var ul = el('ul', 'findings');
    r.findings.forEach(function (f) {
      var li = el('li', f.waived ? 'waived' : '');
      li.appendChild(el('span', 'sev sev-' + f.severity, f.severity));
      li.appendChild(el('code', '', f.check));
      li.appendChild(document.createTextNode(' ' + f.message + (f.line ? ' (line ' + f.line + ')' : '') + (f.waived ? ' [' + f.waived + ']' : '')));
      ul.appendChild(li);
    });
    body.appendChild(ul);
    box.appendChild(body);
    list.appendChild(box);
    return box;
  });
  function apply() {
    var q = search.value.trim().toLowerCase(), ck = fCheck.value, sv = fSev.value, fm = fForm.value, n = 0;
    rows.forEach(function (r, i) {
      var ok = (!q || r.id.toLowerCase().indexOf(q) >= 0) && (!fm || r.form === fm) &&
        (!ck && !sv ? true : r.findings.some(function (f) { return !f.waived && (!ck || f.check === ck) && (!sv || f.severity === sv); }));
      nodes[i].hidden = !ok;
      if (ok) n++;
    });
    shown.textContent = String(n);
    empty.hidden = n !== 0;
  }
  [search, fCheck, fSev, fForm].forEach(function (x) { x.addEventListener('input', apply); x.addEventListener('change', apply); });
  apply();
})();
`;
