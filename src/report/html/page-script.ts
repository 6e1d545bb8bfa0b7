/**
 * The report page's script (plain browser JavaScript, no libraries). Filters the records of the embedded JSON by
 * search text, check, severity and declared form, builds the cards of one page at a time with textContent only,
 * and draws a card's depiction (SVG elements from its 2D layout, see picture.ts) when the card comes into view.
 */
import { DRAW_SCRIPT } from './draw-script.js';

export const PAGE_SCRIPT = `
(function () {
  'use strict';
  var started = performance.now();
  var PAGE = 50;
  var rows = JSON.parse(document.getElementById('report-data').textContent);
  var list = document.getElementById('records');
  var empty = document.getElementById('empty');
  var shown = document.getElementById('shown-count');
  var search = document.getElementById('search');
  var fCheck = document.getElementById('filter-check');
  var fSev = document.getElementById('filter-severity');
  var fForm = document.getElementById('filter-form');
  var numbers = document.getElementById('atom-numbers');
  var pager = document.getElementById('pager');
  var prev = document.getElementById('prev');
  var next = document.getElementById('next');
  var info = document.getElementById('page-info');
  ${DRAW_SCRIPT}
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

  var drawn = [];
  var observer = 'IntersectionObserver' in window ? new IntersectionObserver(function (entries) {
    entries.forEach(function (e) {
      if (!e.isIntersecting) return;
      observer.unobserve(e.target);
      paint(e.target);
    });
  }, { rootMargin: '300px 0px' }) : null;
  function paint(holder) {
    var r = rows[Number(holder.getAttribute('data-i'))];
    holder.textContent = '';
    holder.appendChild(drawPicture(r.pic, r.id, numbers.checked));
    holder.setAttribute('data-drawn', '1');
    drawn.push(holder);
  }
  function side(label, text, extra) {
    var d = el('div');
    d.appendChild(el('b', '', label));
    d.appendChild(document.createTextNode(text));
    if (extra) d.appendChild(extra);
    return d;
  }
  function card(r, i) {
    var box = el('article', 'rec');
    box.setAttribute('data-id', r.id);
    var pic = el('figure', 'pic');
    if (r.pic) {
      var holder = el('div', 'holder', 'drawing…');
      holder.setAttribute('data-i', String(i));
      pic.appendChild(holder);
      pic.appendChild(el('figcaption', '', r.pic.o === 'd' ? 'as drawn in the record (its coordinates and wedges)' : 'layout computed from the structure'));
      if (observer) observer.observe(holder); else paint(holder);
    } else pic.appendChild(el('div', 'nodepict', r.noPicture ? 'no depiction: ' + r.noPicture : 'no depiction'));
    box.appendChild(pic);
    var body = el('div', 'body');
    body.appendChild(el('h3', '', r.id));
    body.appendChild(el('div', 'file', r.file));
    var sides = el('div', 'side');
    var word = r.word ? el('span', 'word', ' (written "' + r.word + '")') : null;
    sides.appendChild(side('declared', r.form + (r.descriptors ? ' ' + r.descriptors : ''), word));
    var comp = side('computed', r.computed + (r.labels ? '; CIP ' + r.labels : ''));
    if (r.undef) comp.appendChild(el('span', 'undef', ' undefined: ' + r.undef));
    sides.appendChild(comp);
    body.appendChild(sides);
    var ul = el('ul', 'findings');
    r.findings.forEach(function (f) {
      var li = el('li', f.waived ? 'waived' : '');
      li.appendChild(el('span', 'sev sev-' + f.severity, f.severity));
      li.appendChild(el('code', '', f.check));
      if (f.line) li.appendChild(el('span', 'line', ' line ' + f.line));
      li.appendChild(document.createTextNode(': ' + f.message + (f.waived ? ' [' + f.waived + ']' : '')));
      ul.appendChild(li);
    });
    (r.notRun || []).forEach(function (n) {
      var li = el('li', 'notrun');
      li.appendChild(el('span', 'sev sev-notrun', 'not run'));
      li.appendChild(el('code', '', n.check));
      li.appendChild(document.createTextNode(': ' + n.reason));
      ul.appendChild(li);
    });
    body.appendChild(ul);
    box.appendChild(body);
    return box;
  }

  var matches = [], page = 0;
  function show() {
    if (observer) observer.disconnect();
    drawn = [];
    list.textContent = '';
    var pages = Math.max(1, Math.ceil(matches.length / PAGE));
    if (page >= pages) page = pages - 1;
    var from = page * PAGE, to = Math.min(matches.length, from + PAGE);
    var frag = document.createDocumentFragment();
    for (var k = from; k < to; k++) frag.appendChild(card(rows[matches[k]], matches[k]));
    list.appendChild(frag);
    pager.hidden = matches.length <= PAGE;
    info.textContent = matches.length ? 'records ' + (from + 1) + '–' + to + ' of ' + matches.length + ' (page ' + (page + 1) + ' of ' + pages + ')' : '';
    prev.disabled = page === 0;
    next.disabled = page >= pages - 1;
  }
  function apply() {
    var q = search.value.trim().toLowerCase(), ck = fCheck.value, sv = fSev.value, fm = fForm.value;
    matches = [];
    for (var i = 0; i < rows.length; i++) {
      var r = rows[i];
      var ok = (!q || r.id.toLowerCase().indexOf(q) >= 0) && (!fm || r.form === fm) &&
        (!ck && !sv ? true : r.findings.some(function (f) { return !f.waived && (!ck || f.check === ck) && (!sv || f.severity === sv); }));
      if (ok) matches.push(i);
    }
    shown.textContent = String(matches.length);
    empty.hidden = matches.length !== 0;
    page = 0;
    show();
  }
  prev.addEventListener('click', function () { page--; show(); list.scrollIntoView(); });
  next.addEventListener('click', function () { page++; show(); list.scrollIntoView(); });
  numbers.addEventListener('change', function () { var old = drawn; drawn = []; old.forEach(paint); });
  [search, fCheck, fSev, fForm].forEach(function (x) { x.addEventListener('input', apply); x.addEventListener('change', apply); });
  apply();
  // how long the script took to make the page usable (read by the tests and the benchmark)
  document.body.setAttribute('data-ready', String(Math.round(performance.now() - started)));
})();
`;
