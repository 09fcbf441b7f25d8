package dev.plumbline.model;

/**
 * What a library method does, as far as the analyses care. The vocabulary is closed so that a
 * typo in the model fails when the model loads, not silently at analysis time.
 */
public enum Effect {
  // data provenance
  /** Splits the receiver's rows; the result holds the parts (DL4J {@code splitTestAndTrain}). */
  SPLIT,
  /** Splits the receiver and returns the parts as an array in argument order (DJL {@code randomSplit}). */
  SPLIT_ARRAY,
  /** Returns one part of a split holder; attribute {@code part}: train, validation or test. */
  SPLIT_PART,
  /**
   * Returns data with the same rows (or a subset thereof) as the receiver: getters, copies,
   * views. For tensor indexing, attribute {@code index}: row, column or leading (axes dropped).
   */
  DERIVE,
  /** Constructor or factory wrapping its data arguments (iterators over lists, data sets from arrays). */
  WRAP,
  /** Fits a preprocessor to the data argument; attribute {@code learns}: whether statistics are learned. */
  FIT_PREPROCESSOR,
  /** Applies a fitted preprocessor to the data argument. */
  APPLY_PREPROCESSOR,
  /** Attaches a preprocessor (argument) to the receiver iterator. */
  ATTACH_PREPROCESSOR,
  /**
   * Computes a statistic over the receiver's rows that is not a tensor reduction. Reductions
   * that are statistics (mean, standard deviation, min, max) are {@link #REDUCE} with attribute
   * {@code statistic=true}.
   */
  STATISTIC,
  /** Trains a model on the data argument. */
  TRAIN,
  /** Evaluates a model on the data argument and returns a score or evaluation. */
  EVALUATE,
  /** Runs the model forward on the input argument. */
  PREDICT,
  /** Shuffles the receiver's rows in place; attribute {@code seeded}: whether a seed argument is given. */
  SHUFFLE,
  /** Sets a random seed. */
  SEED,
  /** The receiver (a record reader) reads its rows from the data argument ({@code dataArg}) from now on. */
  READ_FROM,

  // tensors
  /**
   * Creates a tensor; attribute {@code shape}: how the shape is given (varargs: one size per
   * argument or one array, shape-object: a DJL {@code Shape}, data: the nesting of a data
   * array), from argument {@code shapeArg} (default 0).
   */
  CREATE,
  /** Reshapes the receiver to the sizes from argument {@code shapeArg} (default 0); -1 is inferred. */
  RESHAPE,
  /** Permutes the receiver's axes, given from argument {@code axesArg} (default 0). */
  PERMUTE,
  /** Reverses the receiver's axes. */
  TRANSPOSE,
  /** Matrix product of the receiver and the argument; attribute {@code product}: mmul, matmul or dot. */
  MATMUL,
  /**
   * Reduces along axes. Attribute {@code keepDims}: "true", "false", or "paramN" when the
   * boolean parameter N says so; {@code axesArg}: where the axes are (absent: over everything);
   * {@code engineAxes=one} when an engine may refuse several axes; {@code statistic=true} for
   * mean, deviation, min and max.
   */
  REDUCE,
  /** Element-wise binary operation; attribute {@code inPlace}. */
  ELEMENTWISE,
  /** Row- or column-vector broadcast operation; attributes {@code inPlace}, {@code vector}: row|column. */
  VECTOR_OP,
  /**
   * Joins tensors. Attributes: {@code inputs} (varargs from {@code inputsArg}, list: a DJL
   * {@code NDList} argument, receiver: the receiver and the first argument), {@code axisArg} or a
   * fixed {@code axis}, {@code stack=true} for a new axis, {@code join=hstack|vstack} for ND4J's.
   */
  CONCAT,
  /** Returns a Java scalar detached from any graph or scope. */
  TO_SCALAR,
  /** Returns a copy detached from the autograd graph. */
  DETACH,
  /** Returns a copy of the receiver. */
  COPY,
  /**
   * Reads a shape or one dimension of it; attribute {@code query}: shape, size (argument axis),
   * dim (DJL {@code Shape.get}), rank, rows, columns, length, equals (DJL {@code Shape.equals}).
   */
  SHAPE_QUERY,

  // scopes
  /** Opens an autograd recording scope. */
  OPEN_GRADIENT_SCOPE,
  /** Opens a memory scope (manager, workspace). */
  OPEN_MEMORY_SCOPE,
  /** Runs the forward pass of a model under training. */
  FORWARD,
  /** Computes a loss. */
  LOSS,
  BACKWARD,
  /** Releases native memory now. */
  CLOSE,

  // memory scopes and containers (scope analysis)
  /** Returns the memory scope that owns the receiver (DJL {@code NDArray.getManager()}, {@code Batch.getManager()}). */
  SCOPE_OF,
  /**
   * Moves the receiver into the manager given as argument (DJL {@code attach}); with attribute
   * {@code temporary=true} it returns to its own manager when that one closes ({@code tempAttach}).
   */
  MOVE_TO_SCOPE,
  /** Takes the receiver out of its manager; the caller must close it (DJL {@code detach()}). */
  RELEASE_FROM_SCOPE,
  /**
   * Returns a copy outside the current memory scope, leaving the receiver where it is (ND4J
   * {@code detach()}, {@code leverageTo}); attribute {@code to}: heap, parent or named.
   */
  LEAVE_MEMORY_SCOPE,
  /** Returns the array moved into the workspace open at the call (ND4J {@code migrate()}). */
  MIGRATE,
  /**
   * Stores the argument {@code valueArg} in the receiver container (collection add, map put):
   * the container keeps it alive (scope analysis) and holds its rows (provenance).
   */
  STORE,
  /** Removes every value the receiver container holds. */
  CLEAR,

  // configuration
  /** Configuration builder setter for a hyperparameter; attribute {@code hyperparameter}. */
  CONFIGURE,
  /** Early-stopping configuration taking a score calculator or data. */
  EARLY_STOPPING,
  // shape inference and network configuration (issue 4)
  /** Makes a shape object from sizes given as arguments (DJL {@code new Shape(long...)}). */
  MAKE_SHAPE,
  /** Throws unless its boolean argument holds (attribute {@code conditionArg}, default 0): preconditions. */
  CHECK,
  /** Compares two arrays element by element ({@code Arrays.equals}); used to learn shapes from checks. */
  EQUALS,
  /**
   * Returns what a builder configures: a built layer or network configuration, or a network made
   * from a configuration (constructor attribute {@code configArg}).
   */
  BUILD,
  /**
   * Adds a layer to a network configuration builder; attributes {@code layerArg}, and for graphs
   * {@code nameArg} and {@code inputsArg} (the input names from there on), for lists {@code indexArg}.
   */
  ADD_LAYER,
  /** Starts the layers of a network configuration ({@code list()}, or {@code graphBuilder()} with {@code graph=true}). */
  LAYER_STACK,

  /** A call with no effect the analyses model; listed so the reflection check covers it. */
  NONE
}
