package dev.plumbline.parse;

import java.lang.reflect.Field;

/**
 * The private fields of JavaParser's classes that the parse stage reaches into (see
 * {@link Java21Rules}, {@link ThreadParsers}, {@link TreeCompactor}). Each user degrades to
 * JavaParser's own behaviour when a field is missing, so a missing or inaccessible field is
 * null here, never an error.
 */
final class PrivateFields {
  private PrivateFields() {}

  /** The declared field made accessible, or null if {@code owner} has no such field. */
  static Field find(Class<?> owner, String name) {
    try {
      Field f = owner.getDeclaredField(name);
      f.setAccessible(true);
      return f;
    } catch (NoSuchFieldException | RuntimeException e) {
      return null;
    }
  }
}
