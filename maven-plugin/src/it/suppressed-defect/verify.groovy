// A suppressed finding does not fail the gate, and stays in SARIF with its justification.
def log = new File(basedir, 'build.log').text
assert log.contains('1 suppressed')
assert log.contains('BUILD SUCCESS')
def sarif = new File(basedir, 'target/plumbline.sarif').text
assert sarif.contains('"ruleId" : "leak.preprocessing-before-split"')
assert sarif.contains('"justification" : "this path only feeds a dashboard preview"')
assert sarif.contains('"kind" : "inSource"')
return true
