namespace Lookup.Calibration;

/// <summary>Draws the parameters of each copy edit from a seeded generator, within the ranges <see cref="CopyEditKind"/> states.</summary>
internal static class CopyEditPlan
{
    /// <summary>
    /// The random stream of one photo, from the seed and the photo's path (FNV-1a over its UTF-16 code units), so a
    /// photo keeps its edits when the catalogue grows or the sample size changes.
    /// </summary>
    public static Random ForPhoto(int seed, string path)
    {
        uint hash = 2166136261;
        foreach (char c in path)
        {
            hash = unchecked((hash ^ c) * 16777619);
        }

        return new Random(unchecked((seed * 1_000_003) ^ (int)hash));
    }

    /// <summary>One edit of each requested kind, in the order given.</summary>
    public static CopyEdit[] Draw(Random random, IReadOnlyList<CopyEditKind> kinds)
    {
        var edits = new CopyEdit[kinds.Count];
        for (int i = 0; i < edits.Length; i++)
        {
            edits[i] = Draw(random, kinds[i]);
        }

        return edits;
    }

    private static CopyEdit Draw(Random random, CopyEditKind kind) => kind switch
    {
        CopyEditKind.Recompress => new CopyEdit(kind) { Quality = random.Next(25, 61) },
        CopyEditKind.Downscale => new CopyEdit(kind) { Scale = Between(random, 0.2f, 0.6f), Quality = 85 },
        CopyEditKind.Crop => new CopyEdit(kind)
        {
            CropWidth = Between(random, 0.6f, 0.9f),
            CropHeight = Between(random, 0.6f, 0.9f),
            CropX = random.NextSingle(),
            CropY = random.NextSingle(),
        },
        CopyEditKind.Tone => new CopyEdit(kind) { Brightness = Between(random, 0.7f, 1.35f), Contrast = Between(random, 0.75f, 1.3f) },
        CopyEditKind.WhiteBalance => Cast(random),
        CopyEditKind.Mirror => new CopyEdit(kind) { Mirror = true },
        CopyEditKind.Straighten => new CopyEdit(kind) { Degrees = Between(random, 1f, 6f) * (random.Next(2) == 0 ? -1 : 1) },
        CopyEditKind.WebExport => WebExport(random),
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "Unknown copy edit."),
    };

    private static CopyEdit Cast(Random random)
    {
        float shift = Between(random, -0.15f, 0.15f);
        return new CopyEdit(CopyEditKind.WhiteBalance) { RedGain = 1 + shift, BlueGain = 1 - shift };
    }

    private static CopyEdit WebExport(Random random)
    {
        float keep = Between(random, 0.85f, 0.95f);
        return new CopyEdit(CopyEditKind.WebExport)
        {
            CropWidth = keep,
            CropHeight = keep,
            CropX = random.NextSingle(),
            CropY = random.NextSingle(),
            Scale = Between(random, 0.4f, 0.8f),
            Quality = random.Next(50, 76),
        };
    }

    private static float Between(Random random, float low, float high) => low + ((high - low) * random.NextSingle());
}
