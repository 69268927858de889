using MatchBench;

// MatchBench eval --cli Lookup.Cli.dll --work DIR [--crops none,standard,dense] [--demo DIR]
// MatchBench grow --index FILE --to N [--seed 7] [--noise 0.02]
var options = Arguments.Parse(args.Skip(1));
return args.FirstOrDefault() switch
{
    "eval" => Evaluation.Run(options),
    "grow" => GrowIndex.Run(options),
    _ => Usage(),
};

static int Usage()
{
    Console.Error.WriteLine("usage: MatchBench eval --cli PATH/Lookup.Cli.dll --work DIR [--crops none,standard,dense] [--demo demo-catalogue]");
    Console.Error.WriteLine("       MatchBench grow --index FILE --to PHOTOS [--seed 7] [--noise 0.02]");
    return 2;
}
