(function () {
  'use strict';
  var ruleSelect = document.getElementById('filter-rule');
  var fileSelect = document.getElementById('filter-file');
  var severityBoxes = Array.prototype.slice.call(document.querySelectorAll('input[name="severity"]'));
  var findings = Array.prototype.slice.call(document.querySelectorAll('article.finding'));
  var counter = document.getElementById('shown-count');
  if (!ruleSelect || !fileSelect || !counter) {
    return;
  }

  function anyShown(group) {
    return group.querySelector('article.finding:not([hidden])') !== null;
  }

  function apply() {
    var rule = ruleSelect.value;
    var file = fileSelect.value;
    var severities = {};
    severityBoxes.forEach(function (box) { severities[box.value] = box.checked; });
    var shown = 0;
    findings.forEach(function (f) {
      var visible = (rule === '' || f.getAttribute('data-rule') === rule)
        && (file === '' || f.getAttribute('data-file') === file)
        && severities[f.getAttribute('data-severity')] === true;
      f.hidden = !visible;
      if (visible) { shown++; }
    });
    document.querySelectorAll('.file-group').forEach(function (g) { g.hidden = !anyShown(g); });
    document.querySelectorAll('.rule-group').forEach(function (g) { g.hidden = !anyShown(g); });
    counter.textContent = shown + ' of ' + findings.length + ' findings shown';
  }

  function reset() {
    ruleSelect.value = '';
    fileSelect.value = '';
    severityBoxes.forEach(function (box) { box.checked = true; });
    apply();
  }

  ruleSelect.addEventListener('change', apply);
  fileSelect.addEventListener('change', apply);
  severityBoxes.forEach(function (box) { box.addEventListener('change', apply); });
  document.getElementById('filter-reset').addEventListener('click', reset);
  // A link to a finding that the filters hide shows everything again, so the link lands.
  document.querySelectorAll('a.finding-link').forEach(function (a) {
    a.addEventListener('click', function () {
      var target = document.getElementById(a.getAttribute('href').substring(1));
      if (target && target.hidden) { reset(); }
    });
  });
  apply();
}());
