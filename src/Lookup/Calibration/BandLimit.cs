namespace Lookup.Calibration;

/// <summary>What decided where a verdict band ends.</summary>
public enum BandLimit
{
    /// <summary>The share of stranger pairs allowed inside the band.</summary>
    StrangerRate,

    /// <summary>The band already holds the stated share of copies; reaching further would only admit others.</summary>
    CopyCoverage,

    /// <summary>The same-part band could not end before the copy band, so it is empty.</summary>
    CopyBand,
}
