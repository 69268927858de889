namespace Lookup.Sweeps;

/// <summary>
/// The bounds an <see cref="AlignmentHypothesis"/> must keep for one container and content.
/// </summary>
/// <param name="Width">Container width in pixels.</param>
/// <param name="Height">Container height in pixels.</param>
/// <param name="ContentAspect">Content width over height.</param>
/// <param name="MinCropScale">Smallest scale tried.</param>
/// <param name="NoUpscaleScale">The scale at which the region holds as many pixels as the content (0 when copies
/// may have been enlarged at will).</param>
/// <param name="MaxAngle">Largest turn tried, in degrees.</param>
/// <param name="UpscaleSlack">Enlargement allowed beyond what a turn explains (rounding, editors' habits).</param>
internal readonly record struct SearchSpace(
    int Width, int Height, double ContentAspect, float MinCropScale, float NoUpscaleScale, float MaxAngle, float UpscaleSlack)
{
    /// <summary>The smallest scale allowed for an unturned region.</summary>
    public float MinScale => MinScaleAt(0f);

    /// <summary>Half the region's width and height in fractions of the container's, at <paramref name="scale"/>.</summary>
    public (float HalfWidth, float HalfHeight) HalfExtent(float scale)
    {
        var fitWidth = Math.Min(Width, ContentAspect * Height);
        var fitHeight = fitWidth / ContentAspect;
        return ((float)(scale * fitWidth / Width / 2), (float)(scale * fitHeight / Height / 2));
    }

    /// <summary>
    /// A copy is not enlarged beyond what straightening explains: turning a photo by θ and cutting the largest upright
    /// rectangle of the same shape out of it enlarges it by cos θ + sin θ · max(aspect, 1 / aspect) (worked out).
    /// Without that bound a zoom and a shift make a stereo pair (same scene, camera moved) look like a crop.
    /// </summary>
    public float MinScaleAt(float angleDegrees)
    {
        var (sin, cos) = Math.SinCos(Math.Abs(angleDegrees) * Math.PI / 180);
        var elongation = Math.Max(ContentAspect, 1 / ContentAspect);
        var straightenZoom = cos + (sin * elongation);
        var noUpscale = NoUpscaleScale / (straightenZoom * (1 + UpscaleSlack));
        return Math.Max(MinCropScale, (float)noUpscale);
    }

    /// <summary>Scale and angle within their limits, and the unturned region inside the frame.</summary>
    public bool Contains(in AlignmentHypothesis h)
    {
        if (h.Scale > 1f || Math.Abs(h.AngleDegrees) > MaxAngle || h.Scale < MinScaleAt(h.AngleDegrees))
        {
            return false;
        }

        var (halfWidth, halfHeight) = HalfExtent(h.Scale);
        const float slack = 1e-4f;
        return h.CentreX >= halfWidth - slack && h.CentreX <= 1 - halfWidth + slack &&
               h.CentreY >= halfHeight - slack && h.CentreY <= 1 - halfHeight + slack;
    }
}
