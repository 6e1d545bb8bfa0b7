/**
 * Browser JavaScript that draws a depiction (picture.ts data) as SVG elements: bonds (single, double, triple;
 * wedge, hash, wavy, crossed), heteroatom labels with hydrogens and charges, computed CIP labels in a large bold
 * face beside their atoms (E/Z at the middle of the bond), undefined stereo units in dashed circles with a "?",
 * and atom numbers (the input numbering) when asked for. Everything is made with createElementNS and
 * textContent. Defines `drawPicture(pic, id, showNumbers)` inside the page script's scope.
 */
export const DRAW_SCRIPT = `
  var NS = 'http://www.w3.org/2000/svg';
  var BOND = 32; // px per median bond length
  function svgEl(tag, attrs, text) {
    var e = document.createElementNS(NS, tag);
    for (var k in attrs) e.setAttribute(k, String(attrs[k]));
    if (text !== undefined) e.textContent = text;
    return e;
  }
  function median(v) { v = v.slice().sort(function (a, b) { return a - b; }); return v.length ? v[v.length >> 1] : 1; }
  function drawPicture(p, id, showNumbers) {
    var n = p.x.length, i, k;
    var lens = [];
    for (k = 0; k < p.b.length; k += 4) {
      var dx = p.x[p.b[k]] - p.x[p.b[k + 1]], dy = p.y[p.b[k]] - p.y[p.b[k + 1]];
      lens.push(Math.sqrt(dx * dx + dy * dy));
    }
    var unit = median(lens) || 100;
    var s = BOND / unit;
    var minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
    for (i = 0; i < n; i++) {
      minX = Math.min(minX, p.x[i]); maxX = Math.max(maxX, p.x[i]);
      minY = Math.min(minY, -p.y[i]); maxY = Math.max(maxY, -p.y[i]);
    }
    var pad = 28;
    var X = function (j) { return (p.x[j] - minX) * s + pad; };
    var Y = function (j) { return (-p.y[j] - minY) * s + pad; };
    var w = (maxX - minX) * s + 2 * pad, h = (maxY - minY) * s + 2 * pad;
    var svg = svgEl('svg', { viewBox: '0 0 ' + w.toFixed(1) + ' ' + h.toFixed(1), role: 'img', 'class': 'mol' });
    svg.style.maxWidth = Math.min(w, 900) + 'px';
    svg.appendChild(svgEl('title', {}, 'structure of ' + id + ' with computed CIP labels'));
    var labelled = [];
    for (i = 0; i < n; i++) labelled.push(p.t[i] !== 0);
    // neighbours, for placing labels away from bonds
    var nb = [];
    for (i = 0; i < n; i++) nb.push([]);
    for (k = 0; k < p.b.length; k += 4) { nb[p.b[k]].push(p.b[k + 1]); nb[p.b[k + 1]].push(p.b[k]); }
    var g = svgEl('g', { 'class': 'bonds' });
    for (k = 0; k < p.b.length; k += 4) g.appendChild(bond(p.b[k], p.b[k + 1], p.b[k + 2], p.b[k + 3]));
    svg.appendChild(g);
    function bond(a, b, order, style) {
      var x1 = X(a), y1 = Y(a), x2 = X(b), y2 = Y(b);
      var dx = x2 - x1, dy = y2 - y1, len = Math.sqrt(dx * dx + dy * dy) || 1;
      var ux = dx / len, uy = dy / len, px = -uy, py = ux;
      var ca = labelled[a] ? 8 : 0, cb = labelled[b] ? 8 : 0;
      x1 += ux * ca; y1 += uy * ca; x2 -= ux * cb; y2 -= uy * cb;
      var grp = svgEl('g', {});
      function line(ax, ay, bx, by) { grp.appendChild(svgEl('line', { x1: ax.toFixed(1), y1: ay.toFixed(1), x2: bx.toFixed(1), y2: by.toFixed(1) })); }
      if (style === 1) {
        grp.appendChild(svgEl('polygon', { 'class': 'wedge', points: [x1, y1, x2 + px * 4, y2 + py * 4, x2 - px * 4, y2 - py * 4].map(function (v) { return v.toFixed(1); }).join(' ') }));
      } else if (style === 2) {
        for (var t = 0; t <= 6; t++) {
          var f = t / 6, cx = x1 + (x2 - x1) * f, cy = y1 + (y2 - y1) * f, half = 0.5 + 3.5 * f;
          line(cx + px * half, cy + py * half, cx - px * half, cy - py * half);
        }
      } else if (style === 3) {
        var d = 'M' + x1.toFixed(1) + ' ' + y1.toFixed(1), steps = 8;
        for (var q = 1; q <= steps; q++) {
          var fq = q / steps, off = (q % 2 ? 3 : -3);
          d += ' L' + (x1 + (x2 - x1) * fq + px * (q === steps ? 0 : off)).toFixed(1) + ' ' + (y1 + (y2 - y1) * fq + py * (q === steps ? 0 : off)).toFixed(1);
        }
        grp.appendChild(svgEl('path', { d: d, 'class': 'wavy' }));
      } else if (order === 2 && style === 4) {
        line(x1 + px * 2.5, y1 + py * 2.5, x2 - px * 2.5, y2 - py * 2.5);
        line(x1 - px * 2.5, y1 - py * 2.5, x2 + px * 2.5, y2 + py * 2.5);
      } else if (order === 2) {
        line(x1 + px * 2.5, y1 + py * 2.5, x2 + px * 2.5, y2 + py * 2.5);
        line(x1 - px * 2.5, y1 - py * 2.5, x2 - px * 2.5, y2 - py * 2.5);
      } else if (order === 3) {
        line(x1, y1, x2, y2);
        line(x1 + px * 4, y1 + py * 4, x2 + px * 4, y2 + py * 4);
        line(x1 - px * 4, y1 - py * 4, x2 - px * 4, y2 - py * 4);
      } else line(x1, y1, x2, y2);
      return grp;
    }
    // direction away from the neighbours of atom j (unit vector)
    function away(j) {
      var vx = 0, vy = 0;
      nb[j].forEach(function (o) { var dx = X(j) - X(o), dy = Y(j) - Y(o), l = Math.sqrt(dx * dx + dy * dy) || 1; vx += dx / l; vy += dy / l; });
      var l = Math.sqrt(vx * vx + vy * vy);
      return l < 0.2 ? [0.7, -0.7] : [vx / l, vy / l];
    }
    var atoms = svgEl('g', { 'class': 'atoms' });
    for (i = 0; i < n; i++) {
      var t = p.t[i];
      if (t === 0) continue;
      var txt = svgEl('text', { x: X(i).toFixed(1), y: (Y(i) + 5).toFixed(1), 'text-anchor': 'middle', 'class': 'el el-' + t[0] });
      if (t[3]) txt.appendChild(svgEl('tspan', { 'class': 'sup', dy: '-5' }, String(t[3])));
      txt.appendChild(svgEl('tspan', t[3] ? { dy: '5' } : {}, t[0]));
      if (t[1] > 0) {
        txt.appendChild(svgEl('tspan', {}, 'H'));
        if (t[1] > 1) txt.appendChild(svgEl('tspan', { 'class': 'sub', dy: '4' }, String(t[1])));
        if (t[1] > 1 && t[2]) txt.appendChild(svgEl('tspan', { dy: '-4' }, ''));
      }
      if (t[2]) txt.appendChild(svgEl('tspan', { 'class': 'sup', dy: '-6' }, (Math.abs(t[2]) > 1 ? Math.abs(t[2]) : '') + (t[2] > 0 ? '+' : '\\u2212')));
      atoms.appendChild(txt);
    }
    svg.appendChild(atoms);
    var marks = svgEl('g', { 'class': 'stereo' });
    p.u.forEach(function (u) {
      var at = u[0], label = u[1], defined = u[2];
      if (!defined) {
        at.forEach(function (j) {
          marks.appendChild(svgEl('circle', { cx: X(j).toFixed(1), cy: Y(j).toFixed(1), r: 11, 'class': 'undef' }));
        });
        var a0 = away(at[0]);
        marks.appendChild(svgEl('text', { x: (X(at[0]) + a0[0] * 18).toFixed(1), y: (Y(at[0]) + a0[1] * 18 + 5).toFixed(1), 'text-anchor': 'middle', 'class': 'undef-q' }, '?'));
        return;
      }
      if (!label) return;
      var cx, cy, dir;
      if (at.length === 1) { dir = away(at[0]); cx = X(at[0]) + dir[0] * 20; cy = Y(at[0]) + dir[1] * 20; }
      else {
        var a = at[0], b = at[at.length - 1];
        var mx = (X(a) + X(b)) / 2, my = (Y(a) + Y(b)) / 2, dx = X(b) - X(a), dy = Y(b) - Y(a), l = Math.sqrt(dx * dx + dy * dy) || 1;
        cx = mx - dy / l * 16; cy = my + dx / l * 16;
      }
      marks.appendChild(svgEl('text', { x: cx.toFixed(1), y: (cy + 5).toFixed(1), 'text-anchor': 'middle', 'class': 'cip' }, label));
    });
    svg.appendChild(marks);
    if (showNumbers) {
      var nums = svgEl('g', { 'class': 'numbers' });
      for (i = 0; i < n; i++) {
        if (!p.n[i]) continue;
        var d2 = away(i);
        nums.appendChild(svgEl('text', { x: (X(i) - d2[1] * 10 - d2[0] * 4).toFixed(1), y: (Y(i) + d2[0] * 10 - d2[1] * 4 + 3).toFixed(1), 'text-anchor': 'middle', 'class': 'num' }, String(p.n[i])));
      }
      svg.appendChild(nums);
    }
    return svg;
  }
`;
