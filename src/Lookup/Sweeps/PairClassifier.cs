namespace Lookup.Sweeps;

/// <summary>
/// Decides what two photos are, cheapest evidence first: equal SHA-256 → equal size, near-equal dHash and a tiny
/// embedding distance → thumbnails aligned whole (re-encode, resize, tone, mirror) → thumbnails aligned as a crop
/// or a small turn → otherwise a look-alike across SKUs or nothing. A small embedding distance alone never makes a
/// copy: two studio views of one part sit as close as real copies. Holds an aligner with scratch buffers: one
/// instance per thread.
/// </summary>
internal sealed class PairClassifier
{
    private readonly SweepOptions _options;
    private readonly AlignmentLimits _limits;
    private readonly ThumbnailAligner _aligner = new();
    private readonly DetailComparer _detail = new();
    private readonly ChromaComparer _chroma = new();

    public PairClassifier(SweepOptions options)
    {
        _options = options;
        _limits = AlignmentLimits.From(options);
    }

    /// <param name="a">First photo.</param>
    /// <param name="thumbA">Its thumbnail, or null when none is available.</param>
    /// <param name="b">Second photo.</param>
    /// <param name="thumbB">Its thumbnail, or null.</param>
    /// <param name="distance">Cosine distance of their embeddings.</param>
    public (PairRelation Relation, PairEvidence Evidence) Classify(
        SweepPhoto a, GreyThumbnail? thumbA, SweepPhoto b, GreyThumbnail? thumbB, float distance)
    {
        var evidence = new PairEvidence(
            distance,
            DHashBits.Distance(a.DHash, b.DHash),
            DHashBits.Distance(a.DHash, DHashBits.Mirror(b.DHash)),
            null,
            AlignmentHypothesis.FullFrame,
            CopyEdits.None);

        if (string.Equals(a.Sha256, b.Sha256, StringComparison.OrdinalIgnoreCase))
        {
            return (PairRelation.IdenticalBytes, evidence);
        }

        if (a.Width == b.Width && a.Height == b.Height &&
            evidence.HashDistance <= _options.SamePixelsMaxHashDistance &&
            distance <= _options.SamePixelsMaxDistance)
        {
            return (PairRelation.SamePixels, evidence);
        }

        if (distance <= _options.CopyMaxDistance)
        {
            if (thumbA is not null && thumbB is not null)
            {
                var (best, passed, searched) = BestAlignment(a, thumbA, b, thumbB, distance);
                evidence = evidence with { Correlation = best.Correlation, Alignment = best.Hypothesis };
                if (passed)
                {
                    (passed, evidence) = Confirm(a, b, best, searched, evidence);
                }

                if (passed)
                {
                    var (container, content) = best.ContainerIsA ? (a, b) : (b, a);
                    return (PairRelation.Copy, evidence with { Edits = EditsOf(best.Hypothesis, container, content) });
                }
            }
            else if (CopyByHash(a, b, evidence) is { } edits)
            {
                return (PairRelation.Copy, evidence with { Edits = edits });
            }
        }

        var relation = distance <= _options.LookAlikeMaxDistance && !SameSku(a, b) ? PairRelation.LookAlike : PairRelation.None;
        return (relation, evidence);
    }

    /// <summary>
    /// A placement that passed on the 32 × 32 thumbnails, checked on the finer evidence when both photos have it: the
    /// 64 × 64 detail thumbnails' gradients (whole frames and searched placements each against their own bar), then
    /// colour. Photos without the finer evidence (indexes from before it was stored) keep the 32 × 32 verdict.
    /// </summary>
    private (bool Passed, PairEvidence Evidence) Confirm(SweepPhoto a, SweepPhoto b, in AlignmentResult best, bool searched, PairEvidence evidence)
    {
        var (container, content) = best.ContainerIsA ? (a, b) : (b, a);
        if (container.Detail is not null && content.Detail is not null)
        {
            var detail = _detail.Correlate(container.Detail, PhotoShape.Of(container), content.Detail, PhotoShape.Of(content), best.Hypothesis);
            evidence = evidence with { DetailCorrelation = detail };
            // A searched placement that is a whole frame up to the search's rounding claims no crop or turn, so it
            // meets the whole-frame bar: two scale models of one part (M6 × 30 and M8 × 40 bolts) align that way.
            var h = best.Hypothesis;
            var wholeFrame = !searched || (SameAspect(a, b) && h.Scale >= 0.97f && Math.Abs(h.AngleDegrees) < 1f);
            if (detail < (wholeFrame ? _options.WholeFrameMinDetailCorrelation : _options.AlignedMinDetailCorrelation))
            {
                return (false, evidence);
            }
        }

        if (container.Chroma is not null && content.Chroma is not null)
        {
            var (contentSpread, containerSpread, correlation) =
                _chroma.Compare(container.Chroma, PhotoShape.Of(container), content.Chroma, PhotoShape.Of(content), best.Hypothesis);
            var (smaller, larger) = (Math.Min(contentSpread, containerSpread), Math.Max(contentSpread, containerSpread));
            if (larger >= _options.ColourMinSpread)
            {
                evidence = evidence with { ColourSpread = larger, ColourSpreadRatio = smaller / larger, ColourCorrelation = correlation };
                if (smaller < _options.ColourMinSpreadRatio * larger ||
                    (smaller >= _options.ColourMinSpread && correlation < _options.ColourMinCorrelation))
                {
                    return (false, evidence);
                }
            }
        }

        return (true, evidence);
    }

    private static bool SameSku(SweepPhoto a, SweepPhoto b) => string.Equals(a.Sku, b.Sku, StringComparison.Ordinal);

    private bool SameAspect(SweepPhoto a, SweepPhoto b) =>
        Math.Abs(Math.Log(a.AspectRatio / b.AspectRatio)) <= _options.AspectTolerance;

    /// <summary>Without thumbnails: same aspect ratio and a near-equal dHash (either way round), or no copy.</summary>
    private CopyEdits? CopyByHash(SweepPhoto a, SweepPhoto b, in PairEvidence evidence)
    {
        var mirrored = evidence.MirroredHashDistance < evidence.HashDistance;
        var bits = Math.Min(evidence.HashDistance, evidence.MirroredHashDistance);
        if (!SameAspect(a, b) || bits > _options.CopyMaxHashDistanceWithoutThumbnails)
        {
            return null;
        }

        return (SameSize(a, b) ? CopyEdits.None : CopyEdits.Resized) | (mirrored ? CopyEdits.Mirrored : CopyEdits.None);
    }

    /// <summary>
    /// The whole frames first (one dot product each way, against the stricter whole-frame bar); the crop and turn
    /// search only if they fail and the pair is close enough for a crop. Returns the best alignment and whether it
    /// passed its bar.
    /// </summary>
    private (AlignmentResult Best, bool Passed, bool Searched) BestAlignment(
        SweepPhoto a, GreyThumbnail thumbA, SweepPhoto b, GreyThumbnail thumbB, float distance)
    {
        var best = AlignmentResult.None;
        if (SameAspect(a, b))
        {
            var (plain, mirrored) = _aligner.FullFrame(thumbA, thumbB);
            best = new AlignmentResult(
                Math.Max(plain, mirrored), AlignmentHypothesis.FullFrame with { Mirrored = mirrored > plain }, true);
            if (best.Correlation >= _options.WholeFrameMinCorrelation)
            {
                return (best, true, false);
            }
        }

        if (distance > _options.CropMaxDistance)
        {
            return (best, false, false);
        }

        var searched = _aligner.Search(PhotoShape.Of(a), thumbA, PhotoShape.Of(b), thumbB, _limits);
        return searched.Correlation >= _options.AlignedMinCorrelation
            ? (searched, true, true)
            : (searched.Correlation > best.Correlation ? searched : best, false, true);
    }

    private static bool SameSize(SweepPhoto a, SweepPhoto b) => a.Width == b.Width && a.Height == b.Height;

    /// <summary>Names the edits a placement implies; small tolerances absorb the search's step sizes.</summary>
    private CopyEdits EditsOf(in AlignmentHypothesis h, SweepPhoto container, SweepPhoto content)
    {
        var edits = CopyEdits.None;
        if (h.Mirrored)
        {
            edits |= CopyEdits.Mirrored;
        }

        if (Math.Abs(h.AngleDegrees) >= 1f)
        {
            edits |= CopyEdits.Rotated;
        }

        var cropped = h.Scale < 0.97f || !SameAspect(container, content);
        if (cropped && Math.Abs(h.AngleDegrees) < 1f)
        {
            edits |= CopyEdits.Cropped;
        }

        // A straightened photo is enlarged by the turn's own zoom; only a shrink beyond that counts as a resize then.
        var fitWidth = Math.Min(container.Width, content.AspectRatio * container.Height);
        var ratio = content.Width / (h.Scale * fitWidth);
        if (ratio < 0.97 || (ratio > 1.03 && !edits.HasFlag(CopyEdits.Rotated)))
        {
            edits |= CopyEdits.Resized;
        }

        return edits;
    }
}
