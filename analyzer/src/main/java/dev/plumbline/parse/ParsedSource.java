package dev.plumbline.parse;

import com.github.javaparser.ast.CompilationUnit;
import dev.plumbline.discover.SourceFile;

/**
 * A file that parsed cleanly: its tree and the exact text the tree's positions refer to.
 *
 * @param lineMap maps positions in {@code text} to the report's lines (identity for Java files;
 *     notebook cells for {@code .ipynb})
 */
public record ParsedSource(SourceFile file, String text, CompilationUnit unit, LineMap lineMap) {}
