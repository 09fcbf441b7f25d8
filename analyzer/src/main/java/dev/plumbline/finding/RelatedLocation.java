package dev.plumbline.finding;

/** A secondary place that explains a finding, e.g. where the data became test data. */
public record RelatedLocation(Location location, Message message) {}
