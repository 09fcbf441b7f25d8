// The build failed because of the finding, not for another reason, and the report was written.
def log = new File(basedir, 'build.log').text
assert log.contains('src/main/java/orchard/YieldData.java:13:5: error: ') : 'finding in compiler style'
assert log.contains('[leak.preprocessing-before-split]')
assert log.contains('plumbline: 1 finding at or above \'warning\'')
assert log.contains('BUILD FAILURE')
def sarif = new File(basedir, 'target/plumbline.sarif')
assert sarif.isFile()
assert sarif.text.contains('"ruleId" : "leak.preprocessing-before-split"')
return true
