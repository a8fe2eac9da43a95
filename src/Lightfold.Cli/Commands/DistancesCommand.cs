using System.CommandLine;
using System.Globalization;
using Lightfold.Cosmology;

namespace Lightfold.Cli.Commands;

/// <summary><c>lightfold distances</c>: the cosmology calculator (distances, modulus, times) of the configured cosmology.</summary>
public static class DistancesCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var zList = new Option<string>("--z") { Description = "redshifts, comma-separated, e.g. 0.5,1,2", Required = true };
        var zFrom = new Option<double?>("--z-from") { Description = "lens redshift Z1: also print D_A(Z1, z) and the time-delay distance" };
        var format = new Option<string>("--format") { Description = "table, json or csv", DefaultValueFactory = _ => "table" };
        format.AcceptOnlyFromAmong(TableOutput.Formats);
        var scenario = new ScenarioOptions();

        var command = new Command("distances", "Cosmological distances and times at the given redshifts, for the configured cosmology");
        command.Options.Add(zList);
        command.Options.Add(zFrom);
        command.Options.Add(format);
        scenario.AddTo(command);
        command.SetAction(parse =>
        {
            var cosmology = new FlrwCosmology(scenario.Load(parse, context).Cosmology);
            double[] zs = ParseRedshifts(parse.GetValue(zList)!);
            double? z1 = parse.GetValue(zFrom);
            if (z1 is { } zl && (!double.IsFinite(zl) || zl < 0 || zl > 1100))
                throw new InputException($"--z-from {zl}: expected a redshift in [0, 1100]");
            if (z1 is { } zlens && zs.Any(z => z <= zlens))
                throw new InputException($"--z-from {zlens}: every --z value must exceed it (got {zs.Min()})");

            var columns = new List<string>
            {
                "z", "comoving_distance_mpc", "transverse_comoving_distance_mpc", "angular_diameter_distance_mpc",
                "luminosity_distance_mpc", "distance_modulus_mag", "lookback_time_gyr", "age_gyr",
            };
            if (z1 is not null) columns.AddRange(["z_from", "angular_diameter_distance_from_mpc", "time_delay_distance_mpc"]);
            var rows = zs.Select(z =>
            {
                var row = new List<double>
                {
                    z, cosmology.ComovingDistanceMpc(z), cosmology.TransverseComovingDistanceMpc(z),
                    cosmology.AngularDiameterDistanceMpc(z), cosmology.LuminosityDistanceMpc(z),
                    z > 0 ? cosmology.DistanceModulusMag(z) : double.NaN, cosmology.LookbackTimeGyr(z), cosmology.AgeGyr(z),
                };
                if (z1 is { } from)
                    row.AddRange([from, cosmology.AngularDiameterDistanceMpc(from, z), from > 0 ? cosmology.TimeDelayDistanceMpc(from, z) : double.NaN]);
                return row.ToArray();
            }).ToList();
            TableOutput.Write(context.Out, parse.GetValue(format)!, columns, rows);
            return ExitCodes.Ok;
        });
        return command;
    }

    static double[] ParseRedshifts(string text)
    {
        var parts = text.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries);
        if (parts.Length == 0) throw new InputException("--z: give at least one redshift, e.g. --z 0.5,1,2");
        return parts.Select(p =>
            double.TryParse(p, NumberStyles.Float, CultureInfo.InvariantCulture, out double z) && double.IsFinite(z) && z >= 0 && z <= 1100
                ? z
                : throw new InputException($"--z '{p}': expected a redshift in [0, 1100]")).ToArray();
    }
}
