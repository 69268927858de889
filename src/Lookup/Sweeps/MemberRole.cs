namespace Lookup.Sweeps;

/// <summary>Why a photo is listed in a finding.</summary>
public enum MemberRole
{
    /// <summary>One of the photos the finding is about.</summary>
    Member = 0,

    /// <summary>The photo that may be filed under the wrong SKU.</summary>
    Flagged = 1,

    /// <summary>For comparison: the nearest photo of the flagged photo's own SKU.</summary>
    NearestInOwnSku = 2,

    /// <summary>For comparison: the nearest photo of another SKU.</summary>
    NearestInOtherSku = 3,
}
