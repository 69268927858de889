using System.Globalization;
using Lookup.DemoGenerator.Catalogue;

namespace Lookup.DemoGenerator;

/// <summary>
/// Renders the invented demo catalogue:
/// <c>dotnet run -c Release --project tools/DemoGenerator -- --out demo-catalogue --seed 2026</c>.
/// </summary>
internal static class Program
{
    private const int DefaultSeed = 2026;

    public static int Main(string[] args)
    {
        string? output = null;
        string? sheet = null;
        int seed = DefaultSeed;
        for (int i = 0; i < args.Length; i++)
        {
            switch (args[i])
            {
                case "--out" when i + 1 < args.Length:
                    output = args[++i];
                    break;
                case "--seed" when i + 1 < args.Length && int.TryParse(args[i + 1], NumberStyles.Integer, CultureInfo.InvariantCulture, out int s):
                    seed = s;
                    i++;
                    break;
                case "--contact-sheet" when i + 1 < args.Length:
                    sheet = args[++i];
                    break;
                default:
                    return Usage($"unknown or incomplete option '{args[i]}'");
            }
        }

        if (output is null)
        {
            return Usage("--out is required");
        }

        string command = $"dotnet run -c Release --project tools/DemoGenerator -- --out demo-catalogue --seed {seed}";
        var plan = CataloguePlan.Create(seed);
        Directory.CreateDirectory(output);
        CatalogueWriter.Write(plan, output, command, Console.Error);
        if (sheet is not null)
        {
            var files = plan.All.Select(p => Path.Combine(output, p.File)).ToList();
            ContactSheet.Write(files, sheet, 160, 12);
            Console.Error.WriteLine($"contact sheet: {sheet}");
        }

        return 0;
    }

    private static int Usage(string problem)
    {
        Console.Error.WriteLine($"demo generator: {problem}.");
        Console.Error.WriteLine("usage: dotnet run -c Release --project tools/DemoGenerator -- --out FOLDER [--seed N] [--contact-sheet FILE.png]   (seed defaults to 2026)");
        return 2;
    }
}
