// Without the leak the same build passes, and the report is written with no results.
def log = new File(basedir, 'build.log').text
assert log.contains('plumbline: 0 findings (0 errors, 0 warnings, 0 notes) in 1 of 1 files')
assert log.contains('BUILD SUCCESS')
def sarif = new File(basedir, 'target/plumbline.sarif')
assert sarif.isFile()
assert !sarif.text.contains('"ruleId"')
return true
