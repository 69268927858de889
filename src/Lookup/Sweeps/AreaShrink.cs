namespace Lookup.Sweeps;

/// <summary>
/// Shrinks a grey image to a square of a given side by area averaging: every target pixel is the mean of the source
/// area it covers, fractions of pixels weighted by their share, so every source pixel counts once and JPEG noise
/// averages out. Images smaller than the side in a dimension are stretched (each target pixel takes the source pixel
/// under it).
/// </summary>
internal static class AreaShrink
{
    public static byte[] ToSquare(ReadOnlySpan<byte> grey, int width, int height, int side)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(width);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(height);
        if (grey.Length != (long)width * height)
        {
            throw new ArgumentException(
                $"A {width} × {height} grey image has {(long)width * height} bytes, {grey.Length} were given.", nameof(grey));
        }

        var columns = AreaWeights.For(width, side);
        var rows = AreaWeights.For(height, side);

        // Horizontal pass into height × side floats, then vertical pass into side × side.
        var narrow = new float[height * side];
        for (var y = 0; y < height; y++)
        {
            columns.Apply(grey.Slice(y * width, width), narrow.AsSpan(y * side, side));
        }

        var pixels = new byte[side * side];
        var columnBuffer = new float[height];
        var shrunk = new float[side];
        for (var x = 0; x < side; x++)
        {
            for (var y = 0; y < height; y++)
            {
                columnBuffer[y] = narrow[(y * side) + x];
            }

            rows.Apply(columnBuffer, shrunk);
            for (var y = 0; y < side; y++)
            {
                pixels[(y * side) + x] = (byte)Math.Clamp(MathF.Round(shrunk[y]), 0f, 255f);
            }
        }

        return pixels;
    }
}
