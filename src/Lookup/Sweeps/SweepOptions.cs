namespace Lookup.Sweeps;

/// <summary>
/// Thresholds of the sweep. Each default says where it comes from: "measured" (on the reference photos, see
/// DEVELOPERS.md § Sweeps), "project figures" (the ResNet18 distance ranges the project started from, to be replaced by
/// <c>lookup calibrate</c> on the catalogue itself), "from memory" or "common practice". Distances are cosine
/// distances (1 − dot) of L2-normalised embeddings.
/// </summary>
public sealed record SweepOptions
{
    /// <summary>Same pixels: at most this many differing dHash bits. 0–2 is the design notes' band and common
    /// practice for dHash "identical" (a lossless re-save changes none; rounding in a resampler may flip one or two).</summary>
    public int SamePixelsMaxHashDistance { get; init; } = 2;

    /// <summary>Same pixels: at most this embedding distance. Equal pixels decode to equal tensors, so only float
    /// rounding separates them; 0.001 leaves room for that and for a lossless re-save through another decoder (reasoned,
    /// to be checked against the embedder's measured re-encode distances).</summary>
    public float SamePixelsMaxDistance { get; init; } = 0.001f;

    /// <summary>Copy: pairs farther apart than this are never copies. Project figures: overlays and watermarks up to
    /// 0.2. Measured with the default ResNet18 on planted copies of the reference photos: re-encodes, resizes, tone
    /// changes and mirrors 0.001–0.065 (0.142 for a half-size copy of a 324 × 223 photo), straightened 0.012–0.090,
    /// 80 % crops 0.052–0.138. 0.25 leaves a margin.</summary>
    public float CopyMaxDistance { get; init; } = 0.25f;

    /// <summary>Crop search (the costly step) only for pairs within this distance. Measured with the default ResNet18:
    /// 80 % crops of the 12 reference photos lie 0.052–0.138 from their originals (project figures said up to 0.1);
    /// 0.16 leaves a margin.</summary>
    public float CropMaxDistance { get; init; } = 0.16f;

    /// <summary>Copy, whole frames (same aspect ratio; re-encode, resize, tone, mirror): the thumbnails must correlate
    /// at least this well. Measured on the reference photos: planted whole-frame copies score 0.988 or more; different
    /// items of one Fashion-MNIST class (same outline on a plain background) reach it in 0.03 % of pairs.</summary>
    public float WholeFrameMinCorrelation { get; init; } = 0.97f;

    /// <summary>Copy, searched alignment (crop, small turn): the aligned thumbnails must correlate at least this well.
    /// Measured on the reference photos: planted crops and turns score 0.96 or more, second views of one scene (stereo
    /// and viewpoint pairs) 0.90 at most, unrelated photos 0.74 at most. Outlines on plain backgrounds align too well
    /// under a turn: different Fashion-MNIST items of one class reach it in 2.7 % of pairs (see DEVELOPERS.md § Sweeps).</summary>
    public float AlignedMinCorrelation { get; init; } = 0.95f;

    /// <summary>Copy, whole frames, checked on the 64 × 64 detail thumbnails: their gradients must correlate at least
    /// this well. Measured: planted whole-frame copies of the 12 reference photos (JPEG q40, resize 50 %, brightness
    /// +30 %, mirror) score 0.980 or more; look-alike demo parts rendered in the same pose that passed the 32 × 32 bar
    /// score up to 0.929 in grey (0.979 for a brass and a stainless hinge, which the colour check separates).</summary>
    public float WholeFrameMinDetailCorrelation { get; init; } = 0.96f;

    /// <summary>Copy, searched alignment (crop, turn), checked on the detail thumbnails after a short local search. Measured:
    /// planted 80 % crops and 4° straightens of the reference photos score 0.898 or more (resampling blurs the finest
    /// edges); look-alike demo parts that passed the 32 × 32 bar score 0.862 or less, apart from washers whose
    /// sizes are exact scale models of each other (0.952).</summary>
    public float AlignedMinDetailCorrelation { get; init; } = 0.88f;

    /// <summary>Colour check: it votes only when one photo's colour varies by at least this much over the region (root
    /// mean square of the mean-removed Cb and Cr, in levels). Measured: grey and silver demo parts 0.2–0.9, zinc
    /// 1.0–2.4, brass 6.7–8.8; the reference photos 4.7–30 (0 for the grey box.png).</summary>
    public float ColourMinSpread { get; init; } = 1.0f;

    /// <summary>Colour check: the smaller spread over the larger must be at least this. Measured: planted copies of the
    /// reference photos 0.73 or more (brightness +30 % clips highlights and loses some colour); a brass part against the
    /// same part in stainless steel 0.015–0.03, stainless against zinc 0.14–0.22.</summary>
    public float ColourMinSpreadRatio { get; init; } = 0.5f;

    /// <summary>Colour check, when both photos have colour (spread ≥ <see cref="ColourMinSpread"/>): their patterns
    /// must correlate at least this well. Measured: planted copies of the reference photos 0.94 or more.</summary>
    public float ColourMinCorrelation { get; init; } = 0.8f;

    /// <summary>Copy without thumbnails (dHash alone, same aspect ratio): at most this many differing bits. From
    /// memory: resizes and re-encodes stay within a few bits, unrelated photos differ in about 32; kept low so a
    /// different photo is not called a copy.</summary>
    public int CopyMaxHashDistanceWithoutThumbnails { get; init; } = 6;

    /// <summary>Two aspect ratios are "the same" when their logarithms differ by at most this (3 %: rounding a resize
    /// to whole pixels moves a small photo's ratio by about 1 %).</summary>
    public float AspectTolerance { get; init; } = 0.03f;

    /// <summary>Look-alike: different photos under different SKUs within this distance. Project figures: two views of
    /// one part at 0.01–0.06, different but similar products from 0.07 up.</summary>
    public float LookAlikeMaxDistance { get; init; } = 0.10f;

    /// <summary>Crop search: the smallest crop, as a fraction of the largest region that fits. A crop keeping less than
    /// half the width is rare for product photos (from memory) and too small to compare at 32 × 32.</summary>
    public float MinCropScale { get; init; } = 0.5f;

    /// <summary>Crop search: enlargement a copy may show beyond what straightening explains (3 %: rounding to whole
    /// pixels and editors' resamplers; from memory).</summary>
    public float UpscaleSlack { get; init; } = 0.03f;

    /// <summary>Set when the catalogue enlarges every photo to one size: crops may then be larger than their source.</summary>
    public bool CropsMayBeUpscaled { get; init; }

    /// <summary>Crop search: the largest turn tried. Straightening a tilted photo takes a few degrees (from memory).</summary>
    public float MaxRotationDegrees { get; init; } = 8f;

    /// <summary>Crop search: coarse placements scoring below this are not refined. Chosen well below the final bar; the
    /// planted-copy tests check that no copy is lost to it.</summary>
    public float AlignmentCoarseFloor { get; init; } = 0.6f;

    /// <summary>Outliers: a photo is a candidate when its distance to the rest of its SKU is at least this far. Project
    /// figures: views of one part stay within 0.06, different products reach 0.07 and more.</summary>
    public float OutlierMinDistance { get; init; } = 0.15f;

    /// <summary>Outliers: ... and at least this many times the SKU's typical (median) distance. Common practice for a
    /// robust outlier rule is a multiple of a median spread; 2.5 is a usual choice (from memory).</summary>
    public float OutlierSpreadFactor { get; init; } = 2.5f;

    /// <summary>Outliers: how far to look for a closer photo of another SKU (caps the range search).</summary>
    public float OutlierSearchRadius { get; init; } = 0.6f;

    /// <summary>Threads for the pair search and classification; 0 means one per core.</summary>
    public int MaxDegreeOfParallelism { get; init; }

    /// <summary>The widest distance any finding needs: the radius of the neighbour search.</summary>
    public float SearchRadius => Math.Max(CopyMaxDistance, LookAlikeMaxDistance);

    /// <summary>Checks the values make sense together; the message names the option and the fix.</summary>
    public void Validate()
    {
        Require(SamePixelsMaxDistance >= 0 && SamePixelsMaxDistance <= CopyMaxDistance, nameof(SamePixelsMaxDistance),
            $"must lie in [0, {nameof(CopyMaxDistance)} = {CopyMaxDistance}], is {SamePixelsMaxDistance}");
        Require(CopyMaxDistance is > 0 and <= 2, nameof(CopyMaxDistance), $"must lie in (0, 2], is {CopyMaxDistance}");
        Require(CropMaxDistance >= 0 && CropMaxDistance <= CopyMaxDistance, nameof(CropMaxDistance),
            $"must lie in [0, {nameof(CopyMaxDistance)} = {CopyMaxDistance}], is {CropMaxDistance}");
        Require(LookAlikeMaxDistance is >= 0 and <= 2, nameof(LookAlikeMaxDistance), $"must lie in [0, 2], is {LookAlikeMaxDistance}");
        Require(WholeFrameMinCorrelation is > 0 and <= 1, nameof(WholeFrameMinCorrelation), $"must lie in (0, 1], is {WholeFrameMinCorrelation}");
        Require(AlignedMinCorrelation is > 0 and <= 1, nameof(AlignedMinCorrelation), $"must lie in (0, 1], is {AlignedMinCorrelation}");
        Require(AlignmentCoarseFloor < AlignedMinCorrelation, nameof(AlignmentCoarseFloor),
            $"must be below {nameof(AlignedMinCorrelation)} = {AlignedMinCorrelation}, is {AlignmentCoarseFloor}");
        Require(WholeFrameMinDetailCorrelation is >= 0 and <= 1, nameof(WholeFrameMinDetailCorrelation), $"must lie in [0, 1], is {WholeFrameMinDetailCorrelation}");
        Require(AlignedMinDetailCorrelation is >= 0 and <= 1, nameof(AlignedMinDetailCorrelation), $"must lie in [0, 1], is {AlignedMinDetailCorrelation}");
        Require(ColourMinSpread >= 0, nameof(ColourMinSpread), $"must be 0 or more, is {ColourMinSpread}");
        Require(ColourMinSpreadRatio is >= 0 and <= 1, nameof(ColourMinSpreadRatio), $"must lie in [0, 1], is {ColourMinSpreadRatio}");
        Require(ColourMinCorrelation is >= -1 and <= 1, nameof(ColourMinCorrelation), $"must lie in [-1, 1], is {ColourMinCorrelation}");
        Require(MinCropScale is > 0 and <= 1, nameof(MinCropScale), $"must lie in (0, 1], is {MinCropScale}");
        Require(UpscaleSlack is >= 0 and < 1, nameof(UpscaleSlack), $"must lie in [0, 1), is {UpscaleSlack}");
        Require(MaxRotationDegrees is >= 0 and <= 45, nameof(MaxRotationDegrees), $"must lie in [0, 45], is {MaxRotationDegrees}");
        Require(OutlierSpreadFactor >= 1, nameof(OutlierSpreadFactor), $"must be at least 1, is {OutlierSpreadFactor}");
        Require(OutlierSearchRadius >= OutlierMinDistance, nameof(OutlierSearchRadius),
            $"must be at least {nameof(OutlierMinDistance)} = {OutlierMinDistance}, is {OutlierSearchRadius}");
        Require(MaxDegreeOfParallelism >= 0, nameof(MaxDegreeOfParallelism), $"must be 0 (one per core) or more, is {MaxDegreeOfParallelism}");
    }

    private static void Require(bool condition, string name, string problem)
    {
        if (!condition)
        {
            throw new ArgumentException($"Sweep option {name} {problem}: change it or leave it at its default.", name);
        }
    }
}
