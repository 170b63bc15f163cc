#include "harness/report/html_assets.h"

namespace treegate::report::html {

const char* const kStyle = R"CSS(
:root{--ink:#1d2330;--muted:#5b6475;--paper:#f7f5f0;--card:#fff;--line:#d9d4c7;
--accent:#2f6f73;--accent-soft:#e3eeee;--good:#22704a;--bad:#b3261e;--warn:#9a5300;
--tag:#6b3fa0;--old:#7d8593;--mono:ui-monospace,"DejaVu Sans Mono","Liberation Mono",monospace}
*{box-sizing:border-box}
body{margin:0;background:var(--paper);color:var(--ink);
font:15px/1.45 system-ui,"DejaVu Sans","Liberation Sans",sans-serif}
main{max-width:1200px;margin:0 auto;padding:0 20px 60px}
header.top{background:var(--ink);color:#f3efe6;padding:18px 20px 14px}
header.top .inner{max-width:1200px;margin:0 auto}
header.top h1{margin:0 0 6px;font-size:22px;font-weight:600;letter-spacing:.01em}
header.top dl{display:flex;flex-wrap:wrap;gap:4px 22px;margin:0;font-size:13px}
header.top dt{color:#b9c4c9;display:inline}header.top dd{display:inline;margin:0 0 0 6px;font-family:var(--mono)}
.gate{margin:18px 0;padding:14px 18px;border-radius:8px;border:2px solid;background:var(--card)}
.gate h2{margin:0;font-size:19px}.gate ul{margin:8px 0 0;padding-left:22px}
.gate.pass{border-color:var(--good)}.gate.pass h2{color:var(--good)}
.gate.fail{border-color:var(--bad);border-width:3px}.gate.fail h2{color:var(--bad)}
section{margin-top:28px}
h2.sec{font-size:18px;margin:0 0 10px;padding-bottom:4px;border-bottom:2px solid var(--line)}
.notes p{margin:4px 0;color:var(--muted)}
.cards{display:grid;grid-template-columns:repeat(auto-fill,minmax(160px,1fr));gap:10px}
.card{background:var(--card);border:1px solid var(--line);border-radius:8px;padding:10px 12px}
.card .k{font-size:12px;color:var(--muted);text-transform:uppercase;letter-spacing:.04em}
.card .v{font-size:24px;font-weight:600;font-variant-numeric:tabular-nums}
.card .d{font-size:13px;min-height:1.2em}
.counts{display:flex;flex-wrap:wrap;gap:8px;margin-top:12px;padding:0;list-style:none}
.counts li{background:var(--card);border:1px solid var(--line);border-radius:16px;padding:3px 12px;font-size:14px}
.counts b{font-variant-numeric:tabular-nums}
.delta{font-variant-numeric:tabular-nums;white-space:nowrap;font-weight:600}
.delta.good{color:var(--good)}.delta.bad{color:var(--bad)}.delta.same{color:var(--muted);font-weight:400}
.charts{display:flex;flex-wrap:wrap;gap:18px}
figure.chart{margin:0;background:var(--card);border:1px solid var(--line);border-radius:8px;padding:10px 12px;overflow-x:auto}
figure.chart figcaption{font-weight:600;margin-bottom:4px}
svg.chart text{font:10.5px system-ui,"DejaVu Sans",sans-serif;fill:var(--ink)}
svg.chart .axis{text-anchor:end;fill:var(--muted)}svg.chart .category,svg.chart .value{text-anchor:middle}
svg.chart .grid{stroke:#ebe7de}svg.chart .axis-line{stroke:var(--muted)}
svg.chart .bar.new,.legend .new{fill:var(--accent)}
.hatch-bg{fill:#fff}.hatch-line{stroke:var(--old);stroke-width:3}
rect.hatch{stroke:var(--old);stroke-width:1}
.legend{margin:4px 0 0;font-size:13px;display:flex;gap:16px}.legend svg{vertical-align:-2px}
.grid{display:grid;grid-template-columns:repeat(auto-fit,minmax(min(100%,560px),1fr));gap:4px 28px;align-items:start}
.table-wrap{overflow-x:auto}
table.sortable{border-collapse:collapse;background:var(--card);font-size:14px;width:100%;margin-bottom:4px}
table.sortable th,table.sortable td{border-bottom:1px solid var(--line);padding:4px 10px;text-align:left;white-space:nowrap}
table.sortable td.num,table.sortable th.num{text-align:right;font-variant-numeric:tabular-nums}
table.sortable th{background:var(--accent-soft);padding:0}
table.sortable th button{all:unset;cursor:pointer;display:block;padding:5px 10px;font-weight:600}
table.sortable th button:focus-visible{outline:2px solid var(--accent)}
th[aria-sort=ascending] .sort-mark::after{content:" \25B2"}th[aria-sort=descending] .sort-mark::after{content:" \25BC"}
table.sortable caption{text-align:left;font-weight:600;padding:4px 0}
h3{font-size:15px;margin:18px 0 6px}
.table-note{color:var(--muted);font-size:13px;margin:2px 0 10px}
.filters{display:flex;flex-wrap:wrap;gap:8px 14px;align-items:end;background:var(--card);
border:1px solid var(--line);border-radius:8px;padding:10px 12px;margin-bottom:10px}
.filters label{display:flex;flex-direction:column;font-size:12px;color:var(--muted)}
.filters select,.filters input{font:inherit;font-size:14px;padding:3px 6px;border:1px solid var(--line);border-radius:4px;background:#fff;color:var(--ink)}
.filters input{min-width:16em}
.filters button{font:inherit;font-size:13px;padding:4px 10px;border:1px solid var(--accent);background:var(--accent-soft);color:var(--ink);border-radius:4px;cursor:pointer}
#shown-count{font-size:13px;color:var(--muted);margin-left:auto}
details.case{background:var(--card);border:1px solid var(--line);border-left:6px solid var(--line);border-radius:6px;margin:6px 0}
details.case>summary{cursor:pointer;padding:6px 10px;display:flex;flex-wrap:wrap;gap:4px 12px;align-items:baseline}
details.case.st-fail,details.case.st-error{border-left-color:var(--bad)}
details.case.st-pass{border-left-color:var(--good)}
details.case.st-expected_failure,details.case.st-unexpected_pass{border-left-color:var(--warn)}
.badge{font-size:12px;font-weight:700;padding:1px 7px;border-radius:10px;border:1px solid;white-space:nowrap}
.badge.st-pass{color:var(--good)}.badge.st-fail,.badge.st-error{color:var(--bad)}
.badge.st-expected_failure,.badge.st-unexpected_pass{color:var(--warn)}
.badge.tr{color:var(--ink);border-style:dashed}
.cid{font-family:var(--mono);font-size:13px}.f1{font-variant-numeric:tabular-nums;font-size:13px}
.sentence{color:var(--muted);font-size:13px;flex-basis:100%;white-space:nowrap;overflow:hidden;text-overflow:ellipsis}
.case-body{padding:4px 12px 12px;border-top:1px dashed var(--line)}
.case-body p{margin:6px 0}.reason{font-weight:600}
.diffs{font-size:13px}.diffs ul{margin:2px 0 6px;padding-left:20px;font-family:var(--mono)}
.key{display:flex;flex-wrap:wrap;gap:4px 18px;font-size:12px;color:var(--muted);margin:6px 0}
.key svg{vertical-align:-3px}
.trees{display:flex;flex-wrap:wrap;gap:10px 24px;overflow-x:auto;padding-bottom:6px}
figure.panel{margin:0}figure.panel figcaption{font-weight:600;font-size:13px;color:var(--accent)}
svg.tree text{font:12px var(--mono);text-anchor:middle;fill:var(--ink)}
svg.tree .edges{stroke:#4a5263;stroke-width:1;fill:none}
svg.tree .stems{stroke:#9aa1ad;stroke-width:1;fill:none;stroke-dasharray:2 3}
svg.tree .node rect{fill:var(--accent-soft);stroke:var(--accent);stroke-width:1}
svg.tree .m-wrong rect{fill:#fbe2df;stroke:var(--bad);stroke-width:2.5}
svg.tree .m-missing rect{fill:#fff1d6;stroke:var(--warn);stroke-width:2;stroke-dasharray:5 3}
svg.tree .m-tag rect{stroke:var(--tag);stroke-width:2;stroke-dasharray:1 2}
svg.tree .leaf{font-weight:600}
pre.bracketed{font:12px var(--mono);white-space:pre-wrap;word-break:break-all;background:#f1efe9;padding:6px;border-radius:4px}
.note{color:var(--muted);font-size:13px}
footer{color:var(--muted);font-size:12px;margin-top:40px}
@media print{
 body{background:#fff;font-size:11pt}header.top{background:#fff;color:#000;border-bottom:2px solid #000}
 header.top dt{color:#444}.filters,#expand-controls,.sort-mark{display:none}
 .filters{position:static}section{break-inside:avoid-page}details.case{break-inside:avoid}
 .trees{overflow:visible}svg.tree{max-width:100%;height:auto}
 details.case:not([open]) .sentence{white-space:normal}
 .card,figure.chart,table.sortable,details.case{border-color:#999}
}
)CSS";

const char* const kScript = R"JS(
(function () {
  'use strict';
  function sortTable(th) {
    var table = th.closest('table');
    var index = Array.prototype.indexOf.call(th.parentElement.children, th);
    var numeric = th.classList.contains('num');
    var dir = th.getAttribute('aria-sort') === 'ascending' ? 'descending' : 'ascending';
    table.querySelectorAll('thead th').forEach(function (h) { h.setAttribute('aria-sort', 'none'); });
    th.setAttribute('aria-sort', dir);
    var body = table.tBodies[0];
    var rows = Array.prototype.slice.call(body.rows);
    rows.sort(function (a, b) {
      var x = a.cells[index].getAttribute('data-v'), y = b.cells[index].getAttribute('data-v');
      if (numeric) {
        var fx = x === '' ? NaN : Number(x), fy = y === '' ? NaN : Number(y);
        if (isNaN(fx) || isNaN(fy)) return isNaN(fx) - isNaN(fy);  // empty cells last
        return dir === 'ascending' ? fx - fy : fy - fx;
      }
      var r = x.localeCompare(y);
      return dir === 'ascending' ? r : -r;
    });
    rows.forEach(function (r) { body.appendChild(r); });
  }
  document.querySelectorAll('table.sortable thead th').forEach(function (th) {
    th.querySelector('button').addEventListener('click', function () { sortTable(th); });
  });

  var list = document.getElementById('case-list');
  if (!list) return;
  var cases = Array.prototype.slice.call(list.querySelectorAll(':scope > details.case'));
  var fields = ['suite', 'construction', 'status', 'transition'].map(function (k) {
    return [k, document.getElementById('filter-' + k)];
  });
  var text = document.getElementById('filter-text');
  var count = document.getElementById('shown-count');
  function apply() {
    var query = text.value.trim().toLowerCase();
    var shown = 0;
    cases.forEach(function (el) {
      var ok = fields.every(function (f) {
        var want = f[1] ? f[1].value : '';
        if (!want) return true;
        if (f[0] === 'construction') return JSON.parse(el.dataset.constructions).indexOf(want) >= 0;
        return el.dataset[f[0]] === want;
      });
      if (ok && query) {
        ok = el.dataset.words.toLowerCase().indexOf(query) >= 0 ||
             el.dataset.id.toLowerCase().indexOf(query) >= 0;
      }
      el.hidden = !ok;
      if (ok) shown++;
    });
    count.textContent = shown + ' of ' + cases.length + ' cases shown';
  }
  fields.forEach(function (f) { if (f[1]) f[1].addEventListener('change', apply); });
  text.addEventListener('input', apply);
  function openAll(open) {
    cases.forEach(function (el) { if (!el.hidden) el.open = open; });
  }
  document.getElementById('expand-all').addEventListener('click', function () { openAll(true); });
  document.getElementById('collapse-all').addEventListener('click', function () { openAll(false); });
  apply();
})();
)JS";

}  // namespace treegate::report::html
