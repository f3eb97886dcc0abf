/**
 * The report's only script: reads the embedded frontier JSON (#frontier-data) and, as the
 * #budget-slider moves, shows that level's totals and funded projects and moves the chart's
 * ring, marking the sites added compared with the chosen budget. It writes text with textContent only, so scenario text is never parsed as HTML.
 * Numbers are formatted as formatMoney / formatFixed format them (en-US grouping).
 */
export const BUDGET_SLIDER_SCRIPT = `(function () {
  "use strict";
  var data = JSON.parse(document.getElementById("frontier-data").textContent);
  var slider = document.getElementById("budget-slider");
  var ring = document.getElementById("frontier-current");
  var chosenSites = data.levels[data.chosen].funded.map(function (project) { return project[0]; });
  function money(value) { return value === null ? "\\u2013" : Math.round(value).toLocaleString("en-US"); }
  function fixed(value, decimals) { return value === null ? "\\u2013" : value.toLocaleString("en-US", { minimumFractionDigits: decimals, maximumFractionDigits: decimals }); }
  function put(id, value, text) {
    var element = document.getElementById(id);
    element.textContent = text;
    element.setAttribute("data-value", value === null ? "" : String(value));
  }
  function cell(row, text, numeric) {
    var td = document.createElement("td");
    td.textContent = text;
    if (numeric) td.className = "num";
    row.appendChild(td);
  }
  function show(index) {
    var level = data.levels[index];
    var totals = level.totals;
    put("slider-budget", level.budget, money(level.budget) + " " + data.currency);
    slider.setAttribute("aria-valuetext", money(level.budget) + " " + data.currency);
    put("slider-projects", totals && totals.projects, totals ? String(totals.projects) : "\\u2013");
    put("slider-cost", totals && totals.cost, totals ? money(totals.cost) : "\\u2013");
    put("slider-ksi", totals && totals.ksiAvoided, totals ? fixed(totals.ksiAvoided, 1) : "\\u2013");
    put("slider-ksi-per-year", totals && totals.ksiAvoidedPerYear, totals ? fixed(totals.ksiAvoidedPerYear, 2) : "\\u2013");
    put("slider-benefit", totals && totals.benefitPV, totals ? money(totals.benefitPV) : "\\u2013");
    put("slider-bc", totals && totals.bcRatio, totals ? fixed(totals.bcRatio, 1) : "\\u2013");
    put("slider-npv", totals && totals.npv, totals ? money(totals.npv) : "\\u2013");
    put("slider-cost-per-ksi", totals && totals.costPerKsi, totals ? money(totals.costPerKsi) : "\\u2013");
    document.getElementById("slider-status").textContent = totals
      ? (index === data.chosen ? "This is the chosen budget: the list matches the capital list above." : "")
      : "No list is possible at this budget: the must-fund rules alone cost more.";
    var here = level.funded.map(function (project) { return project[0]; });
    var dropped = chosenSites.filter(function (site) { return here.indexOf(site) < 0; }).map(function (site) { return data.sites[site].id; });
    var added = here.filter(function (site) { return chosenSites.indexOf(site) < 0; }).length;
    document.getElementById("slider-change").textContent = index === data.chosen || !totals ? "" :
      "Compared with the chosen budget: " + added + " site" + (added === 1 ? "" : "s") + " added, " + dropped.length + " dropped" + (dropped.length > 0 ? " (" + dropped.join(", ") + ")" : "") + ".";
    var body = document.getElementById("slider-funded");
    while (body.firstChild) body.removeChild(body.firstChild);
    level.funded.forEach(function (project) {
      var site = data.sites[project[0]];
      var row = document.createElement("tr");
      row.setAttribute("data-site", site.id);
      cell(row, site.id + " " + site.name, false);
      cell(row, site.district, false);
      cell(row, project[1], false);
      cell(row, money(project[2]), true);
      cell(row, fixed(project[3], 2), true);
      cell(row, chosenSites.indexOf(project[0]) < 0 ? "added" : "", false);
      row.lastChild.className = "change";
      body.appendChild(row);
    });
    var point = document.querySelector('circle.level[data-level="' + index + '"]');
    if (point) {
      ring.setAttribute("cx", point.getAttribute("data-x"));
      ring.setAttribute("cy", point.getAttribute("data-y"));
      ring.setAttribute("visibility", "visible");
    } else {
      ring.setAttribute("visibility", "hidden");
    }
  }
  slider.addEventListener("input", function () { show(Number(slider.value)); });
  show(Number(slider.value));
})();`;
