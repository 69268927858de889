using Lookup.DemoGenerator.Parts;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>
/// The invented supplier's range. SKU codes are family-size-finish, e.g. HB-M8x40-ZN is a hex bolt M8 × 40 mm,
/// zinc-plated. Every SKU and name here is made up for the demo.
/// </summary>
internal static class SupplierRange
{
    public const string Supplier = "Tollerby Bolt & Brass";
    public const string Town = "Wrenmoor Quay";

    public static IReadOnlyList<PartSpec> Skus { get; } =
    [
        Bolt(6, 30, Finish.ZincPlated), Bolt(8, 40, Finish.ZincPlated), Bolt(10, 40, Finish.ZincPlated),
        Bolt(8, 40, Finish.BlackOxide), Bolt(8, 60, Finish.Stainless), Bolt(10, 60, Finish.Stainless),
        Nut(6, Finish.ZincPlated), Nut(8, Finish.ZincPlated), Nut(10, Finish.ZincPlated), Nut(8, Finish.BlackOxide), Nut(10, Finish.Stainless),
        Washer(6, Finish.ZincPlated), Washer(8, Finish.ZincPlated), Washer(10, Finish.ZincPlated), Washer(10, Finish.Stainless),
        SpringWasher(8, Finish.ZincPlated), SpringWasher(10, Finish.ZincPlated), SpringWasher(8, Finish.BlackOxide),
        Bracket(40, Finish.ZincPlated), Bracket(40, Finish.BlackOxide), Bracket(60, Finish.ZincPlated), Bracket(60, Finish.Stainless),
        Hinge(75, Finish.Brass), Hinge(75, Finish.Stainless), Hinge(100, Finish.Brass), Hinge(100, Finish.Stainless),
        Elbow(15, Finish.Brass), Elbow(22, Finish.Brass),
        Tee(15, Finish.Brass), Tee(22, Finish.Brass), Tee(22, Finish.Stainless),
        Gear(20, Finish.BlackOxide), Gear(24, Finish.BlackOxide), Gear(24, Finish.Brass), Gear(32, Finish.Brass),
        Spring(12, 30, Finish.Stainless), Spring(16, 40, Finish.Stainless), Spring(16, 40, Finish.ZincPlated), Spring(16, 40, Finish.BlackOxide),
        Pulley(60, 1, Finish.BlackOxide), Pulley(80, 1, Finish.BlackOxide), Pulley(80, 2, Finish.BlackOxide), Pulley(80, 1, Finish.ZincPlated),
        EyeBolt(8, Finish.ZincPlated), EyeBolt(10, Finish.ZincPlated), EyeBolt(10, Finish.Stainless),
    ];

    /// <summary>Parts the supplier does not sell; their field photos must come back as "no match".</summary>
    public static IReadOnlyList<PartSpec> Strangers { get; } =
    [
        new("X-WN-M8-ZN", PartKind.WingNut, Finish.ZincPlated, 8, 0, 0, "wing nut M8, zinc-plated (not stocked)"),
        new("X-SC-M8x40-BO", PartKind.SocketCapScrew, Finish.BlackOxide, 8, 40, 0, "socket head cap screw M8 × 40, black oxide (not stocked)"),
        new("X-PX-15-BR", PartKind.PipeCross, Finish.Brass, 15, 0, 0, "equal cross 15 mm, brass (not stocked)"),
    ];

    public static IReadOnlyList<LookAlikeGroup> LookAlikes { get; } =
    [
        new("same bolt length and finish, M8 vs M10", ["HB-M8x40-ZN", "HB-M10x40-ZN"]),
        new("same bolt, zinc vs black oxide", ["HB-M8x40-ZN", "HB-M8x40-BO"]),
        new("stainless bolts 60 mm long, M8 vs M10", ["HB-M8x60-SS", "HB-M10x60-SS"]),
        new("zinc hex nuts in three sizes", ["HN-M6-ZN", "HN-M8-ZN", "HN-M10-ZN"]),
        new("same nut, zinc vs black oxide", ["HN-M8-ZN", "HN-M8-BO"]),
        new("zinc flat washers in three sizes", ["FW-M6-ZN", "FW-M8-ZN", "FW-M10-ZN"]),
        new("same washer, zinc vs stainless", ["FW-M10-ZN", "FW-M10-SS"]),
        new("zinc spring washers, M8 vs M10", ["SW-M8-ZN", "SW-M10-ZN"]),
        new("same bracket, zinc vs black oxide", ["AB-40-ZN", "AB-40-BO"]),
        new("zinc brackets, 40 vs 60 mm legs", ["AB-40-ZN", "AB-60-ZN"]),
        new("brass hinges, 75 vs 100 mm", ["BH-75-BR", "BH-100-BR"]),
        new("same hinge, brass vs stainless", ["BH-75-BR", "BH-75-SS"]),
        new("same hinge, brass vs stainless", ["BH-100-BR", "BH-100-SS"]),
        new("brass elbows, 15 vs 22 mm", ["PE-15-BR", "PE-22-BR"]),
        new("brass tees, 15 vs 22 mm", ["PT-15-BR", "PT-22-BR"]),
        new("same tee, brass vs stainless", ["PT-22-BR", "PT-22-SS"]),
        new("black gears, 20 vs 24 teeth", ["SG-20T-BO", "SG-24T-BO"]),
        new("same spring, three finishes", ["CS-16x40-SS", "CS-16x40-ZN", "CS-16x40-BO"]),
        new("single-groove black pulleys, 60 vs 80 mm", ["VP-60-1G-BO", "VP-80-1G-BO"]),
        new("same pulley, black vs zinc", ["VP-80-1G-BO", "VP-80-1G-ZN"]),
        new("zinc eye bolts, M8 vs M10", ["EB-M8-ZN", "EB-M10-ZN"]),
    ];

    public static PartSpec Find(string code) =>
        Skus.Concat(Strangers).FirstOrDefault(s => s.Code == code)
        ?? throw new ArgumentException($"No SKU '{code}' in the demo range; see SupplierRange.Skus.", nameof(code));

    private static string F(Finish finish) => FinishInfo.Code(finish);

    private static string N(Finish finish) => FinishInfo.Name(finish);

    private static PartSpec Bolt(int d, int length, Finish f) =>
        new($"HB-M{d}x{length}-{F(f)}", PartKind.HexBolt, f, d, length, 0, $"hex head bolt M{d} × {length} mm, {N(f)}");

    private static PartSpec Nut(int d, Finish f) => new($"HN-M{d}-{F(f)}", PartKind.HexNut, f, d, 0, 0, $"hex nut M{d}, {N(f)}");

    private static PartSpec Washer(int d, Finish f) => new($"FW-M{d}-{F(f)}", PartKind.FlatWasher, f, d, 0, 0, $"flat washer M{d}, {N(f)}");

    private static PartSpec SpringWasher(int d, Finish f) =>
        new($"SW-M{d}-{F(f)}", PartKind.SpringWasher, f, d, 0, 0, $"split spring washer M{d}, {N(f)}");

    private static PartSpec Bracket(int leg, Finish f) =>
        new($"AB-{leg}-{F(f)}", PartKind.AngleBracket, f, leg, 0, 0, $"angle bracket {leg} × {leg} mm, ribbed, {N(f)}");

    private static PartSpec Hinge(int length, Finish f) => new($"BH-{length}-{F(f)}", PartKind.ButtHinge, f, length, 0, 0, $"butt hinge {length} mm, {N(f)}");

    private static PartSpec Elbow(int d, Finish f) => new($"PE-{d}-{F(f)}", PartKind.PipeElbow, f, d, 0, 0, $"90° elbow for {d} mm pipe, {N(f)}");

    private static PartSpec Tee(int d, Finish f) => new($"PT-{d}-{F(f)}", PartKind.PipeTee, f, d, 0, 0, $"equal tee for {d} mm pipe, {N(f)}");

    private static PartSpec Gear(int teeth, Finish f) =>
        new($"SG-{teeth}T-{F(f)}", PartKind.SpurGear, f, 1.5, 10, teeth, $"spur gear module 1.5, {teeth} teeth, {N(f)}");

    private static PartSpec Spring(int outside, int length, Finish f) =>
        new($"CS-{outside}x{length}-{F(f)}", PartKind.CoilSpring, f, outside, length, length / 6, $"compression spring {outside} mm OD × {length} mm, {N(f)}");

    private static PartSpec Pulley(int outside, int grooves, Finish f) =>
        new($"VP-{outside}-{grooves}G-{F(f)}", PartKind.VBeltPulley, f, outside, 0, grooves, $"V-belt pulley {outside} mm, {grooves} groove{(grooves > 1 ? "s" : "")} (A section), {N(f)}");

    private static PartSpec EyeBolt(int d, Finish f) => new($"EB-M{d}-{F(f)}", PartKind.EyeBolt, f, d, 0, 0, $"collar eye bolt M{d}, {N(f)}");
}
