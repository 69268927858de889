namespace Lookup.Calibration;

/// <summary>Why calibration could not run.</summary>
public enum CalibrationProblem
{
    /// <summary>The index holds no catalogue yet (never ingested into).</summary>
    NotIngested,

    /// <summary>Fewer indexed photos with a SKU than <see cref="CalibrationOptions.MinPhotos"/>.</summary>
    TooFewPhotos,

    /// <summary>Fewer SKUs than <see cref="CalibrationOptions.MinSkus"/>.</summary>
    TooFewSkus,

    /// <summary>The embedder is not the model the index was built with.</summary>
    ModelMismatch,

    /// <summary>The catalogue folder the photos were ingested from is not there.</summary>
    CatalogueMissing,

    /// <summary>None of the sampled photos could be read and decoded.</summary>
    NoReadablePhotos,
}
