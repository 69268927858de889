namespace Lookup.Sweeps;

/// <summary>What a catalogue owner must act on, most severe (costliest) first.</summary>
public enum FindingKind
{
    /// <summary>One photo (identical, same pixels or an edited copy) filed under two or more SKUs.</summary>
    SamePhotoSeveralSkus = 0,

    /// <summary>Copies of one photo inside one SKU.</summary>
    CopiesInOneSku = 1,

    /// <summary>Different photos under different SKUs that look alike: possibly the same part filed twice.</summary>
    LookAlikesAcrossSkus = 2,

    /// <summary>A photo far from the rest of its SKU and closer to another SKU: possibly filed under the wrong SKU.</summary>
    FarFromItsSku = 3,
}
