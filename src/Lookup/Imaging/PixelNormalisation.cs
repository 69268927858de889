namespace Lookup.Imaging;

/// <summary>
/// How 8-bit RGB pixels become a network's input values, per output plane c at pixel i:
/// value = (pixel[source(c)] · Scale − Mean[c]) / Std[c] − MeanImage[c, i].
/// Mean and Std are given in the network's channel order; MeanImage, when present, is a whole
/// Size × Size image per plane (networks trained with a per-pixel mean, such as the default ResNet18).
/// </summary>
public sealed class PixelNormalisation
{
    private readonly float[] gain;
    private readonly float[] offset;
    private readonly float[]? meanImage;

    /// <summary>Creates a normalisation; <paramref name="meanImage"/> is planar (3 × size × size) in network order.</summary>
    public PixelNormalisation(int size, ChannelOrder channelOrder, float scale, IReadOnlyList<float> mean, IReadOnlyList<float> std, float[]? meanImage = null)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(size);
        ArgumentNullException.ThrowIfNull(mean);
        ArgumentNullException.ThrowIfNull(std);
        if (mean.Count != 3 || std.Count != 3)
        {
            throw new ArgumentException($"Mean and std need 3 values each, one per colour plane; got {mean.Count} and {std.Count}.");
        }

        if (std.Any(s => s == 0 || !float.IsFinite(s)) || !float.IsFinite(scale) || scale == 0)
        {
            throw new ArgumentException($"Scale ({scale}) and every std value ({string.Join(", ", std)}) must be finite and non-zero.");
        }

        if (meanImage is not null && meanImage.Length != 3 * size * size)
        {
            throw new ArgumentException($"The mean image has {meanImage.Length} values; a {size} × {size} input needs {3 * size * size}.", nameof(meanImage));
        }

        Size = size;
        ChannelOrder = channelOrder;
        Scale = scale;
        Mean = [.. mean];
        Std = [.. std];
        this.meanImage = meanImage;
        gain = [scale / std[0], scale / std[1], scale / std[2]];
        offset = [-mean[0] / std[0], -mean[1] / std[1], -mean[2] / std[2]];
    }

    /// <summary>Raw RGB values 0–255, no mean: the input of a separate preprocessing model.</summary>
    public static PixelNormalisation Identity(int size) => new(size, ChannelOrder.Rgb, 1f, [0f, 0f, 0f], [1f, 1f, 1f]);

    /// <summary>Side of the square input, in pixels.</summary>
    public int Size { get; }

    /// <summary>Order of the planes written.</summary>
    public ChannelOrder ChannelOrder { get; }

    /// <summary>Multiplier applied to 0–255 values before the mean is subtracted.</summary>
    public float Scale { get; }

    /// <summary>Per-plane mean, network order.</summary>
    public IReadOnlyList<float> Mean { get; }

    /// <summary>Per-plane standard deviation, network order.</summary>
    public IReadOnlyList<float> Std { get; }

    /// <summary>True when a per-pixel mean image is subtracted.</summary>
    public bool HasMeanImage => meanImage is not null;

    /// <summary>Floats in one CHW tensor: 3 × Size × Size.</summary>
    public int TensorLength => 3 * Size * Size;

    internal ReadOnlySpan<float> Gain => gain;

    internal ReadOnlySpan<float> Offset => offset;

    internal ReadOnlySpan<float> MeanImage => meanImage;

    /// <summary>Index of the RGB byte (0 red, 1 green, 2 blue) that feeds output plane <paramref name="plane"/>.</summary>
    internal int SourceChannel(int plane) => ChannelOrder == ChannelOrder.Rgb ? plane : 2 - plane;
}
