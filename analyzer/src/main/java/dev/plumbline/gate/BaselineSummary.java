package dev.plumbline.gate;

/**
 * How a scan compared with a baseline.
 *
 * @param file the baseline as the user named it
 * @param known findings the baseline accepts, left out of the report
 * @param stale baseline entries that matched no finding (fixed, or their code changed)
 */
public record BaselineSummary(String file, int known, int stale) {}
