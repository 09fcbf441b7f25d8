package dev.plumbline.model;

/** What a library type is, as far as the analyses care. */
public enum TypeRole {
  /** An n-dimensional array: ND4J {@code INDArray}, DJL {@code NDArray}, SameDiff {@code SDVariable}. */
  TENSOR,
  /** A set of rows held in memory (DL4J {@code DataSet}, DJL {@code Dataset}). */
  DATASET,
  /** An iterator over batches of rows. */
  DATA_ITERATOR,
  /** A record reader or input split (DataVec). */
  RECORD_SOURCE,
  /** The result of a split, holding train and test parts. */
  SPLIT_HOLDER,
  /** A preprocessor that is fitted to data and then applied. */
  NORMALIZER,
  /** A trainable model or its trainer. */
  MODEL,
  /** A memory scope: DJL {@code NDManager}, ND4J {@code MemoryWorkspace}. */
  MEMORY_SCOPE,
  /** An autograd recording scope: DJL {@code GradientCollector}. */
  GRADIENT_SCOPE,
  /** An evaluation result object. */
  EVALUATION,
  /** A network or training configuration builder. */
  CONFIG_BUILDER,
  /** A source of random numbers. */
  RANDOM,

  // scope analysis
  /** A list of tensors that is itself a native resource (DJL {@code NDList}). */
  TENSOR_LIST,
  /** A Java collection or map that can keep values alive (java.util). */
  CONTAINER,
  /** A resource that owns a memory scope of its own and releases it on close (DJL {@code Batch}). */
  SCOPED_RESOURCE
}
