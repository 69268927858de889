namespace Lookup.Matching;

/// <summary>The safety caution every match answer carries, in tables and JSON alike.</summary>
public static class MatchCaution
{
    /// <summary>
    /// A look-alike part in a brake, a pressure line or lifting gear can hurt someone, and a photo cannot show
    /// grade, thread pitch, material or rating.
    /// </summary>
    public const string Text =
        "Caution: a visual match is not verification. Check the part number, dimensions and rating before fitting " +
        "anything safety-critical (brakes, pressure lines, lifting gear), and follow local codes and licensed practice.";
}
