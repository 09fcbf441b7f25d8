package dev.plumbline.flow;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * Golden dumps of control-flow graphs: one line per node, "id KIND line text -> successors",
 * with T/F for branch edges and E for exception edges. Targets follow JLS chapter 14.
 */
class CfgBuilderTest {

  @Test
  void ifElseJoins() {
    assertEquals("""
        0 ENTRY -> 1
        1 EVAL L1 int x = 1; -> 2
        2 CONDITION L1 c -> 3T 4F
        3 EVAL L1 x = 2; -> 5
        4 EVAL L1 x = 3; -> 5
        5 EVAL L1 use(x); -> 6
        6 EXIT ->
        """, CfgDumpTool.dump("void a(boolean c){ int x = 1; if (c) { x = 2; } else { x = 3; } use(x); }"));
  }

  @Test
  void whileWithBreakAndContinue() {
    assertEquals("""
        0 ENTRY -> 1
        1 EVAL L1 int i = 0; -> 2
        2 JOIN -> 3 [loop-head]
        3 CONDITION L1 i < n -> 4T 8F
        4 CONDITION L1 i == 3 -> 5F 8T
        5 CONDITION L1 i == 1 -> 6T 7F
        6 EVAL L1 i++; -> 2
        7 EVAL L1 i++; -> 2
        8 EVAL L1 done(); -> 9
        9 EXIT ->
        """, CfgDumpTool.dump(
            "void b(int n){ int i = 0; while (i < n) { if (i == 3) break; if (i == 1) { i++; continue; } i++; } done(); }"));
  }

  @Test
  void returnInsideTryRunsFinallyFirst() {
    assertEquals("""
        0 ENTRY -> 1
        1 EVAL L1 open(); -> 2 3E 5E
        2 EVAL L1 return 1; -> 3E 5E 5
        3 CATCH L1 catch (RuntimeException e) { log(e); } -> 4
        4 EVAL L1 log(e); -> 5 5E
        5 JOIN L1 { close(); } -> 6
        6 EVAL L1 close(); -> 7 8
        7 EVAL L1 return 2; -> 8
        8 EXIT ->
        """, CfgDumpTool.dump(
            "int c(){ try { open(); return 1; } catch (RuntimeException e) { log(e); } finally { close(); } return 2; }"));
  }

  @Test
  void forEachBindsThenLoops() {
    assertEquals("""
        0 ENTRY -> 1
        1 EVAL L1 xs -> 2
        2 JOIN -> 3 [loop-head]
        3 FOREACH_NEXT L1 for (String s : xs) -> 4T 6F
        4 CONDITION L1 s.isEmpty() -> 2T 5F
        5 EVAL L1 use(s); -> 2
        6 EVAL L1 end(); -> 7
        7 EXIT ->
        """, CfgDumpTool.dump(
            "void d(java.util.List<String> xs){ for (String s : xs) { if (s.isEmpty()) continue; use(s); } end(); }"));
  }

  @Test
  void switchFallsThroughUntilBreak() {
    assertEquals("""
        0 ENTRY -> 1
        1 EVAL L1 k -> 2 4 6
        2 JOIN L1 case 1: one(); -> 3
        3 EVAL L1 one(); -> 4
        4 JOIN L1 case 2: two(); break; -> 5
        5 EVAL L1 two(); -> 8
        6 JOIN L1 default: other(); -> 7
        7 EVAL L1 other(); -> 8
        8 EVAL L1 after(); -> 9
        9 EXIT ->
        """, CfgDumpTool.dump(
            "void e(int k){ switch (k) { case 1: one(); case 2: two(); break; default: other(); } after(); }"));
  }

  @Test
  void labeledJumpsAndDoWhile() {
    assertEquals("""
        0 ENTRY -> 1
        1 EVAL L1 int i = 0 -> 2
        2 JOIN -> 3 [loop-head]
        3 CONDITION L1 i < 3 -> 4T 11F
        4 EVAL L1 int j = 0 -> 5
        5 JOIN -> 6 [loop-head]
        6 CONDITION L1 j < 3 -> 7T 10F
        7 CONDITION L1 j == i -> 8F 10T
        8 CONDITION L1 j > 2 -> 9F 11T
        9 EVAL L1 j++ -> 5
        10 EVAL L1 i++ -> 2
        11 JOIN -> 12 [loop-head]
        12 EVAL L1 g(); -> 13
        13 CONDITION L1 h() -> 11T 14F
        14 EXIT ->
        """, CfgDumpTool.dump("void f(){ outer: for (int i = 0; i < 3; i++) { for (int j = 0; j < 3; j++) {"
            + " if (j == i) continue outer; if (j > 2) break outer; } } do { g(); } while (h()); }"));
  }

  @Test
  void infiniteLoopHasNoFalseExit() {
    assertEquals("""
        0 ENTRY -> 1
        1 JOIN -> 2 [loop-head]
        2 CONDITION L1 true -> 3T
        3 CONDITION L1 done() -> 4F 5T
        4 EVAL L1 work(); -> 1
        5 EVAL L1 after(); -> 6
        6 EXIT ->
        """, CfgDumpTool.dump("void g(){ while (true) { if (done()) break; work(); } after(); }"));
  }
}
