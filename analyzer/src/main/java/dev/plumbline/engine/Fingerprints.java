package dev.plumbline.engine;

import com.github.javaparser.ast.Node;
import com.github.javaparser.ast.body.CallableDeclaration;
import com.github.javaparser.ast.body.TypeDeclaration;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HashMap;
import java.util.HexFormat;
import java.util.IdentityHashMap;
import java.util.Map;
import java.util.regex.Pattern;

/**
 * Stable identities for findings, independent of line numbers: a finding keeps its fingerprint
 * when unrelated lines are added above it, and a second instance of the same defect in the same
 * method gets a different one.
 *
 * <p>Identity = rule id, file, enclosing type and callable signature, the harmful code's text
 * with whitespace collapsed, and the occurrence number of that same text within the callable.
 * Hashed with SHA-256, 16 hex digits kept.
 */
final class Fingerprints {
  private static final Pattern WHITESPACE = Pattern.compile("\\s+");

  private final Map<String, Integer> occurrences = new HashMap<>();
  private final Map<Node, String> signatures = new IdentityHashMap<>();

  /** Call in report order within one file so occurrence numbers are deterministic. */
  String next(String ruleId, String uri, Node node) {
    String key = ruleId + "\n" + uri + "\n" + enclosingSignature(node) + "\n"
        + WHITESPACE.matcher(node.toString()).replaceAll(" ").trim();
    int occurrence = occurrences.merge(key, 1, Integer::sum);
    return sha256(key + "\n#" + occurrence).substring(0, 16);
  }

  /**
   * "/Type/method(params)" of the declarations around {@code node}, outermost first. Memoized per
   * declaration: a file's findings mostly share a few methods, and printing a signature is costly.
   */
  private String enclosingSignature(Node node) {
    Node declaration = node;
    while (declaration != null && !isSignaturePart(declaration)) {
      declaration = declaration.getParentNode().orElse(null);
    }
    if (declaration == null) {
      return "";
    }
    String known = signatures.get(declaration);
    if (known == null) {
      String own = declaration instanceof CallableDeclaration<?> c
          ? c.getDeclarationAsString(false, false, false)
          : ((TypeDeclaration<?>) declaration).getNameAsString();
      known = enclosingSignature(declaration.getParentNode().orElse(null)) + "/" + own;
      signatures.put(declaration, known);
    }
    return known;
  }

  private static boolean isSignaturePart(Node node) {
    return node instanceof CallableDeclaration<?> || node instanceof TypeDeclaration<?>;
  }

  private static String sha256(String s) {
    try {
      MessageDigest md = MessageDigest.getInstance("SHA-256");
      return HexFormat.of().formatHex(md.digest(s.getBytes(StandardCharsets.UTF_8)));
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("SHA-256 is required by every Java platform", e);
    }
  }
}
