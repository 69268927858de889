using Lookup.DemoGenerator.Geometry;
using Lookup.DemoGenerator.Rendering;

namespace Lookup.DemoGenerator.Parts;

/// <summary>SKU codes, names and the rendered look of each <see cref="Finish"/>.</summary>
internal static class FinishInfo
{
    public static string Code(Finish finish) => finish switch
    {
        Finish.ZincPlated => "ZN",
        Finish.BlackOxide => "BO",
        Finish.Brass => "BR",
        _ => "SS",
    };

    public static string Name(Finish finish) => finish switch
    {
        Finish.ZincPlated => "zinc-plated",
        Finish.BlackOxide => "black oxide",
        Finish.Brass => "brass",
        _ => "stainless",
    };

    /// <summary>Metal tints are linear reflectances; roughness blurs the reflected studio.</summary>
    public static Material Look(Finish finish) => finish switch
    {
        Finish.ZincPlated => new Material(new Vec3(0.70, 0.76, 0.86), Metallic: 1.0, Roughness: 0.38, SpecularExponentLog2: 6),
        Finish.BlackOxide => new Material(new Vec3(0.085, 0.085, 0.095), Metallic: 0.85, Roughness: 0.55, SpecularExponentLog2: 5),
        Finish.Brass => new Material(new Vec3(0.88, 0.68, 0.32), Metallic: 1.0, Roughness: 0.22, SpecularExponentLog2: 7),
        _ => new Material(new Vec3(0.64, 0.64, 0.63), Metallic: 1.0, Roughness: 0.15, SpecularExponentLog2: 8),
    };
}
