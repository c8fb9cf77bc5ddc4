// chart.js pieces the tools use, registered once; imported dynamically so only the two chart pages load it.
import {
  CategoryScale,
  Chart,
  Filler,
  Legend,
  LinearScale,
  LineController,
  LineElement,
  LogarithmicScale,
  PointElement,
  Tooltip,
} from 'chart.js';

Chart.register(LineController, LineElement, PointElement, LinearScale, LogarithmicScale, CategoryScale, Tooltip, Legend, Filler);

export { Line } from 'react-chartjs-2';
