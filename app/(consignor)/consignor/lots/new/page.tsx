import { CautionStrip } from "@/components/CautionStrip";
import { LotDetailsForm } from "@/components/lots/LotDetailsForm";

export const metadata = { title: "Start a lot" };

export default function NewLotPage() {
  return (
    <div className="max-w-3xl space-y-5">
      <h1 className="text-2xl font-semibold">Start a lot</h1>
      <p className="text-flash-700">
        Describe the box first; you add the tubes, readings and photos next, then send it to the house for review.
      </p>
      <CautionStrip anchor="high-voltage">
        Testing is optional. Tube testers carry lethal voltages: list what you know rather than power equipment you are
        not trained to use.
      </CautionStrip>
      <LotDetailsForm />
    </div>
  );
}
